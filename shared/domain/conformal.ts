// Split conformal calibration of a prediction's width (Vovk, Gammerman & Shafer 2005,
// "Algorithmic Learning in a Random World"; Lei, G'Sell, Rinaldo, Tibshirani & Wasserman 2018,
// "Distribution-Free Predictive Inference for Regression", JASA 113(523): 1094–1111).
//
// A model is fitted on one set of cases; on a second, held-out set (the calibration set) each
// case gives a score: how far the outcome fell past the prediction, in units of the prediction's
// own spread. The ⌈(n + 1)·p⌉-th smallest of the n scores is the calibrated factor: a new case
// exchangeable with the calibration set falls inside "prediction + factor × spread" with
// probability at least p, and at most p + 1/(n + 1) when the scores have no ties (Lei et al.
// 2018, split conformal; the "locally weighted" score, residual over a spread, is their
// variant — theorem and section numbers from memory, so not cited here). Fitting the factor
// apart for groups of cases (Mondrian conformal, Vovk et al. 2005, from memory) keeps the
// promise within each group.

/**
 * The split conformal quantile of `scores` at level `p`: the ⌈(n + 1)·p⌉-th smallest score
 * (Infinity when that rank is past n: too few cases to promise p). Scores may be ±Infinity.
 */
export function conformalQuantile(scores: readonly number[], p: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError('p must be between 0 and 1');
  const n = scores.length;
  const rank = Math.ceil((n + 1) * p);
  if (rank > n) return Infinity;
  const sorted = [...scores].sort((a, b) => a - b);
  return sorted[rank - 1];
}

/**
 * The normalized score of one case: (outcome − centre) / spread. A case whose prediction has no
 * spread scores 0 when the outcome is the centre and ±Infinity otherwise (no factor widens it).
 */
export function normalizedScore(outcomeMinusCentre: number, spread: number): number {
  if (spread > 0) return outcomeMinusCentre / spread;
  if (outcomeMinusCentre === 0) return 0;
  return outcomeMinusCentre > 0 ? Infinity : -Infinity;
}
