// Spreadsheet formula injection: a cell that starts with = + - @ tab or CR is taken as a formula
// by Excel, LibreOffice and Google Sheets when a CSV is opened (OWASP, "CSV Injection").
// Written cells are escaped with papaparse's escapeFormulae (a leading single quote); read
// cells that would be formulas are pointed out before an import.
import Papa from 'papaparse';

/** The characters that start a formula (OWASP CSV Injection; papaparse's default escapeFormulae set). */
export const FORMULA_START = /^[=+\-@\t\r]/;

export const looksLikeFormula = (cell: string): boolean => FORMULA_START.test(cell);

export type CsvCell = string | number | boolean | null;

/** The one way the product writes CSV: CRLF lines (RFC 4180), formula-like text cells escaped. */
export function toCsv(fields: string[], rows: CsvCell[][]): string {
  return Papa.unparse({ fields, data: rows.map((r) => r.map((c) => (c === null ? '' : c))) }, { newline: '\r\n', escapeFormulae: true });
}
