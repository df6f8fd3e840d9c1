// Axes for shares (0–1) that stay readable: yields near 100 % would be bars of equal length on a
// 0–100 % axis, so the axis starts at a round step below the lowest value and says so.

export interface PercentAxis {
  domain: [number, number];
  /** true when the axis does not start at 0 % (the chart must say so) */
  zoomed: boolean;
}

const STEPS = [0.001, 0.002, 0.005, 0.01, 0.02, 0.05, 0.1, 0.2];

/**
 * The axis for these shares: from a round value below the lowest (leaving at least a tenth of the
 * span as room) to 100 %. When the lowest value is under 50 % the axis is simply 0–100 %.
 */
export function percentAxis(values: readonly (number | null | undefined)[]): PercentAxis {
  const xs = values.filter((v): v is number => typeof v === 'number' && Number.isFinite(v));
  if (xs.length === 0) return { domain: [0, 1], zoomed: false };
  const lo = Math.min(...xs);
  if (lo < 0.5) return { domain: [0, 1], zoomed: false };
  const span = Math.max(1 - lo, 0.001);
  // a step about a quarter of the span keeps four or five gridlines
  const step = STEPS.find((s) => s >= span / 4) ?? 0.2;
  const floor = Math.max(0, Math.floor((lo - span * 0.1) / step - 1e-9) * step);
  const start = Math.round(floor * 10_000) / 10_000;
  return { domain: [start, 1], zoomed: start > 0 };
}
