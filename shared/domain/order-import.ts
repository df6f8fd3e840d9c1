// Orders from a CSV file: each row is read into the order spec and checked with the same
// schema as the order form; every bad cell is named so the planner can fix the file.
import Papa from 'papaparse';
import { looksLikeFormula } from './csv-safety';
import { orderSpecSchema, specWarnings, type OrderSpec, type SpecWarning } from '@shared/schemas/orders';

/** Columns of the import file, in the order of the downloadable example. */
export const IMPORT_COLUMNS = [
  'customer',
  'title',
  'productType',
  'process',
  'material',
  'sizeMm',
  'quantity',
  'overrunPct',
  'colours',
  'plating',
  'backingType',
  'backingCount',
  'backLogo',
  'printing',
  'epoxy',
  'packaging',
  'dueDate',
  'notes',
  'secondPlating',
  'sandblast',
] as const;
export type ImportColumn = (typeof IMPORT_COLUMNS)[number];

export const REQUIRED_IMPORT_COLUMNS: readonly ImportColumn[] = [
  'customer',
  'title',
  'process',
  'material',
  'sizeMm',
  'quantity',
  'plating',
  'backingType',
  'packaging',
  'dueDate',
];

export const MAX_IMPORT_ROWS = 1000;
export const MAX_IMPORT_BYTES = 1024 * 1024;

export const IMPORT_EXAMPLE = [
  IMPORT_COLUMNS.join(','),
  'Harbour Rowing Club,Club crest,pin,hard_enamel,iron,25,500,5,"Navy (C-281) #1b2a4a; White #ffffff",gold,butterfly_clutch,1,no,no,no,individual_bag,2026-05-29,,,no',
].join('\n');

export interface ImportCellError {
  column: ImportColumn | null;
  message: string;
}

export interface ImportRow {
  /** line in the file (the header is line 1) */
  line: number;
  raw: Record<string, string>;
  spec: OrderSpec | null;
  errors: ImportCellError[];
  warnings: SpecWarning[];
  /** cells a spreadsheet would run as formulas (they are imported as text) */
  formulaCells: ImportCellError[];
}

export interface ImportPreview {
  /** problems with the file as a whole (no row can be imported) */
  fileErrors: string[];
  unknownColumns: string[];
  rows: ImportRow[];
  validCount: number;
}

const key = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, '');
const COLUMN_BY_KEY = new Map<string, ImportColumn>(IMPORT_COLUMNS.map((c) => [key(c), c]));
// a few headers people write by hand
for (const [alias, col] of [
  ['size', 'sizeMm'],
  ['qty', 'quantity'],
  ['overrun', 'overrunPct'],
  ['colors', 'colours'],
  ['backing', 'backingType'],
  ['fitting', 'backingType'],
  ['fittings', 'backingType'],
  ['fittingcount', 'backingCount'],
  ['due', 'dueDate'],
  ['product', 'productType'],
  ['secondfinish', 'secondPlating'],
  ['twotone', 'secondPlating'],
  ['texture', 'sandblast'],
] as const) {
  COLUMN_BY_KEY.set(alias, col);
}

const ENUM_ALIASES: Record<string, string> = {
  '3d_die_cast': 'die_cast_3d',
  die_cast: 'die_cast_3d',
  zinc: 'zinc_alloy',
  struck: 'die_struck',
  hard: 'hard_enamel',
  soft: 'soft_enamel',
  bag: 'individual_bag',
  card: 'backing_card',
  keyring: 'key_ring',
};

function enumValue(v: string): string {
  const k = v.trim().toLowerCase().replace(/[\s-]+/g, '_');
  return ENUM_ALIASES[k] ?? k;
}

function numberValue(v: string): number | string {
  const t = v.trim().replace(/\s/g, '');
  if (t === '') return v;
  const n = Number(t.replace(',', '.'));
  return Number.isFinite(n) ? n : v;
}

const TRUE = new Set(['yes', 'y', 'true', '1', 'x']);
const FALSE = new Set(['no', 'n', 'false', '0', '']);
function booleanValue(v: string): boolean | string {
  const t = v.trim().toLowerCase();
  if (TRUE.has(t)) return true;
  if (FALSE.has(t)) return false;
  return v;
}

/** "Navy (C-281) #1b2a4a; White #fff0f0; Gold" → colours. */
export function parseColoursCell(cell: string): { name: string; ref?: string; hex?: string }[] {
  return cell
    .split(/[;|]/)
    .map((part) => part.trim())
    .filter(Boolean)
    .map((part) => {
      const hex = /#[0-9a-fA-F]{6}\b/.exec(part)?.[0];
      const ref = /\(([^)]*)\)/.exec(part)?.[1]?.trim();
      const name = part.replace(/#[0-9a-fA-F]{3,8}\b/, '').replace(/\([^)]*\)/, '').trim();
      return { name, ...(ref ? { ref } : {}), ...(hex ? { hex: hex.toLowerCase() } : {}) };
    });
}

/** The colours as they are written in the import file. */
export function formatColoursCell(colours: readonly { name: string; ref?: string; hex?: string }[]): string {
  return colours.map((c) => [c.name, c.ref ? `(${c.ref})` : '', c.hex ?? ''].filter(Boolean).join(' ')).join('; ');
}

function toSpecInput(raw: Record<string, string>): Record<string, unknown> {
  const get = (c: ImportColumn) => raw[c] ?? '';
  const input: Record<string, unknown> = {
    customer: get('customer').trim() || undefined,
    title: get('title'),
    process: enumValue(get('process')),
    material: enumValue(get('material')),
    sizeMm: numberValue(get('sizeMm')),
    quantity: numberValue(get('quantity')),
    colours: parseColoursCell(get('colours')),
    plating: enumValue(get('plating')),
    backing: {
      type: enumValue(get('backingType')),
      count: get('backingCount').trim() === '' ? (enumValue(get('backingType')) === 'none' ? 0 : 1) : numberValue(get('backingCount')),
    },
    backLogo: booleanValue(get('backLogo')),
    printing: booleanValue(get('printing')),
    epoxy: booleanValue(get('epoxy')),
    secondPlating: get('secondPlating').trim() === '' ? null : enumValue(get('secondPlating')),
    sandblast: booleanValue(get('sandblast')),
    packaging: enumValue(get('packaging')),
    dueDate: get('dueDate').trim(),
    notes: get('notes'),
  };
  if (get('productType').trim()) input.productType = enumValue(get('productType'));
  if (get('overrunPct').trim()) input.overrunPct = numberValue(get('overrunPct').replace('%', ''));
  return input;
}

function columnOf(path: readonly PropertyKey[]): ImportColumn | null {
  const [head, sub] = path;
  if (head === 'backing') return sub === 'count' ? 'backingCount' : 'backingType';
  if (head === 'customerId') return 'customer';
  return IMPORT_COLUMNS.includes(head as ImportColumn) ? (head as ImportColumn) : null;
}

/** Reads a CSV text into a preview: each row parsed, each bad cell named. Nothing is saved. */
export function previewOrderImport(csv: string): ImportPreview {
  const fileErrors: string[] = [];
  const text = csv.replace(/^\uFEFF/, '');
  if (text.trim() === '') return { fileErrors: ['The file is empty'], unknownColumns: [], rows: [], validCount: 0 };
  // spreadsheets in some locales save with ';' — let the parser guess between ',' ';' and tab
  const parsed = Papa.parse<string[]>(text, { skipEmptyLines: 'greedy', delimitersToGuess: [',', ';', '\t'] });
  const [header, ...body] = parsed.data;
  if (!header || header.length < 2) {
    return { fileErrors: ['This does not look like a CSV file with a header row'], unknownColumns: [], rows: [], validCount: 0 };
  }
  const columns = header.map((h) => COLUMN_BY_KEY.get(key(h)) ?? null);
  const unknownColumns = header.filter((_, i) => columns[i] === null).map((h) => h.trim());
  const missing = REQUIRED_IMPORT_COLUMNS.filter((c) => !columns.includes(c));
  if (missing.length) fileErrors.push(`Missing columns: ${missing.join(', ')}`);
  if (body.length === 0) fileErrors.push('The file has a header but no orders');
  if (body.length > MAX_IMPORT_ROWS) fileErrors.push(`At most ${MAX_IMPORT_ROWS} orders per file (this one has ${body.length})`);
  if (fileErrors.length) return { fileErrors, unknownColumns, rows: [], validCount: 0 };

  const rows: ImportRow[] = body.map((cells, i) => {
    const raw: Record<string, string> = {};
    columns.forEach((c, j) => {
      if (c) raw[c] = cells[j] ?? '';
    });
    const errors: ImportCellError[] = [];
    if (cells.length !== header.length) {
      errors.push({ column: null, message: `Has ${cells.length} cells where the header has ${header.length}` });
    }
    const result = orderSpecSchema.safeParse(toSpecInput(raw));
    if (!result.success) {
      for (const issue of result.error.issues) {
        const column = columnOf(issue.path);
        // one message per cell is enough for a planner
        if (!errors.some((e) => e.column === column)) errors.push({ column, message: issue.message });
      }
    }
    const spec = errors.length === 0 && result.success ? result.data : null;
    const formulaCells: ImportCellError[] = columns.flatMap((c, j) =>
      looksLikeFormula(cells[j] ?? '')
        ? [{ column: c, message: `"${(cells[j] ?? '').slice(0, 40)}" starts like a spreadsheet formula; it is kept as text. Check the cell in the sheet.` }]
        : [],
    );
    return { line: i + 2, raw, spec, errors, warnings: spec ? specWarnings(spec) : [], formulaCells };
  });
  const validCount = rows.filter((r) => r.spec).length;
  if (validCount === 0) fileErrors.push('No row can be imported');
  return { fileErrors, unknownColumns, rows, validCount };
}
