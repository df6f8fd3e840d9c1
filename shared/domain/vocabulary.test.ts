import { describe, expect, it } from 'vitest';
import { standardMinutes } from './vocabulary';

// Common practice for routing standard times: set-up (here per tray) plus run time per piece
// times the quantity. Hand-worked figures.
describe('standard minutes of a step', () => {
  const plating = { trayMinutes: 12, pieceMinutes: 0.15 };

  it('is tray minutes plus piece minutes × pieces: 12 + 0.15 × 200 = 42', () => {
    expect(standardMinutes(plating, 200)).toBeCloseTo(42, 10);
  });

  it('is the tray minutes alone when a step has no piece time (engraving a mould)', () => {
    expect(standardMinutes({ trayMinutes: 240, pieceMinutes: 0 }, 1)).toBe(240);
  });

  it('counts tray minutes once per tray: 2.5 trays of 500 pieces = 12 × 2.5 + 0.15 × 500 = 105', () => {
    expect(standardMinutes(plating, 500, 2.5)).toBeCloseTo(105, 10);
    expect(standardMinutes(plating, 200, 1)).toBe(standardMinutes(plating, 200));
  });
});
