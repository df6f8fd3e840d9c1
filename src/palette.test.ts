import { describe, expect, it } from 'vitest';
import fs from 'node:fs';
import { hex } from 'wcag-contrast';

// WCAG 2.x contrast (W3C, Web Content Accessibility Guidelines, success criterion 1.4.3):
// normal text needs 4.5:1. The ratio is computed by the wcag-contrast package from the registry.
const css = fs.readFileSync(new URL('./index.css', import.meta.url), 'utf8');
const colour = (name: string) => {
  if (name === 'white') return '#ffffff';
  const m = css.match(new RegExp(`--color-${name}:\\s*(#[0-9a-fA-F]{6})`));
  if (!m) throw new Error(`no --color-${name} in index.css`);
  return m[1];
};

// The text/background pairs the screens use.
const pairs: [string, string][] = [
  ['ink', 'paper'],
  ['harbour-700', 'paper'],
  ['harbour-700', 'harbour-50'],
  ['harbour-800', 'harbour-50'],
  ['harbour-800', 'harbour-100'],
  ['harbour-900', 'brass-400'],
  ['ok-700', 'ok-50'],
  ['warn-700', 'warn-50'],
  ['stop-700', 'stop-50'],
  ['stop-700', 'paper'],
  // the wall and floor tiles, light theme
  ['harbour-700', 'white'],
  ['harbour-900', 'white'],
  ['harbour-900', 'paper'],
  ['harbour-700', 'warn-50'],
  ['harbour-900', 'warn-50'],
  ['harbour-900', 'brass-300'],
  // the wall, dark theme
  ['white', 'wall-page'],
  ['white', 'wall-tile'],
  ['white', 'wall-hot'],
  ['white', 'wall-stop'],
  ['wall-muted', 'wall-page'],
  ['wall-muted', 'wall-tile'],
  ['wall-muted', 'wall-hot'],
  ['brass-300', 'wall-tile'],
];

// Outlines that mark a state (an empty station's dashed edge) are non-text contrast: 3:1 against
// what is next to them (WCAG 2.1, success criterion 1.4.11).
const outlines: [string, string][] = [
  ['wall-idle-edge', 'wall-page'],
  ['wall-idle-edge', 'wall-tile'],
  ['harbour-600', 'paper'],
  ['harbour-600', 'white'],
  // the focus ring: dark outline on light surfaces, brass halo on dark ones
  ['harbour-800', 'paper'],
  ['harbour-800', 'white'],
  ['brass-300', 'wall-page'],
  ['brass-300', 'harbour-800'],
];

describe('palette meets WCAG AA contrast for normal text', () => {
  it.each(pairs)('%s on %s', (fg, bg) => {
    expect(hex(colour(fg), colour(bg))).toBeGreaterThanOrEqual(4.5);
  });
  it.each(outlines)('outline %s against %s reaches 3:1', (edge, bg) => {
    expect(hex(colour(edge), colour(bg))).toBeGreaterThanOrEqual(3);
  });
  it('white text on the dark header and buttons', () => {
    for (const bg of ['harbour-800', 'harbour-700', 'stop-700']) expect(hex('#ffffff', colour(bg))).toBeGreaterThanOrEqual(4.5);
  });
});
