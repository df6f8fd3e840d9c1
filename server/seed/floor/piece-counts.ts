// What a step does to the pieces: now and then some are scrapped with a reason, and a few are
// reworked at the enamel bench or at inspection and passed.
import type { StationKind } from '@shared/domain/vocabulary';
import type { Rng } from '../prng';

/** Chance that a step scraps some pieces, and how many (fraction of the pieces in). */
export const SCRAP: Partial<Record<StationKind, { p: number; max: number; reasons: string[] }>> = {
  strike: { p: 0.3, max: 0.02, reasons: ['misstrike'] },
  cast: { p: 0.45, max: 0.035, reasons: ['casting_porosity'] },
  trim: { p: 0.1, max: 0.01, reasons: ['scratch'] },
  post: { p: 0.25, max: 0.015, reasons: ['bent_post'] },
  solder: { p: 0.2, max: 0.015, reasons: ['solder_joint'] },
  fill: { p: 0.12, max: 0.015, reasons: ['colour_bleed', 'wrong_colour'] },
  cure: { p: 0.3, max: 0.01, reasons: ['colour_bleed'] },
  stone: { p: 0.2, max: 0.015, reasons: ['over_stoned'] },
  polish: { p: 0.1, max: 0.01, reasons: ['scratch'] },
  sandblast: { p: 0.12, max: 0.01, reasons: ['blast_uneven'] },
  plate: { p: 0.25, max: 0.03, reasons: ['plating_defect'] },
  antique: { p: 0.2, max: 0.015, reasons: ['antique_uneven'] },
  print: { p: 0.25, max: 0.025, reasons: ['print_misregister'] },
  epoxy: { p: 0.3, max: 0.02, reasons: ['epoxy_bubble'] },
  inspect: { p: 0.55, max: 0.02, reasons: ['scratch', 'colour_bleed', 'plating_defect'] },
  pack: { p: 0.04, max: 0.004, reasons: ['counting_loss'] },
};

export interface PieceCounts {
  good: number;
  scrap: number;
  rework: number;
  reason: string | null;
  note: string | null;
}

/** A mould traveller: one mould, made or checked. */
export const ONE_MOULD: PieceCounts = { good: 1, scrap: 0, rework: 0, reason: null, note: null };

/** The counts a finish scan reports for `qty` pieces in at a station of this kind. */
export function pieceCounts(rng: Rng, kind: StationKind, qty: number): PieceCounts {
  const rule = SCRAP[kind];
  let scrap = 0;
  let reason: string | null = null;
  if (rule && qty > 1 && rng.chance(rule.p)) {
    scrap = Math.min(qty - 1, Math.max(1, Math.round(qty * rule.max * rng.next())));
    reason = rng.pick(rule.reasons);
  }
  const good = qty - scrap;
  let rework = 0;
  let note: string | null = null;
  if ((kind === 'fill' || kind === 'inspect') && good > 4 && rng.chance(0.07)) {
    rework = Math.min(good, rng.int(1, 4));
    note = kind === 'fill' ? 'Underfilled cells topped up' : 'Touched up and passed';
  }
  return { good, scrap, rework, reason, note };
}
