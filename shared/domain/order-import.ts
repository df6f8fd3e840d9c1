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

/** What is wrong with a cell, as a code and its values, so each language can say it. */
export type ImportIssueCode =
  | 'missing'
  | 'not_a_choice'
  | 'not_a_number'
  | 'not_whole'
  | 'not_yes_no'
  | 'not_a_date'
  | 'too_small'
  | 'too_big'
  | 'too_long'
  | 'bad_swatch'
  | 'no_colour'
  | 'cell_count'
  | 'formula'
  | 'rule';

export interface ImportCellError {
  column: ImportColumn | null;
  code: ImportIssueCode;
  params: Record<string, string | number>;
  /** the same, written in English for a planner */
  message: string;
}

/** A row that imports but should be looked at first. */
export interface ImportRowWarning {
  code: 'due_in_past' | 'due_soon' | SpecWarning['code'];
  message: string;
  params: Record<string, string | number>;
}

export type ImportFileIssueCode = 'empty' | 'not_csv' | 'missing_columns' | 'no_rows' | 'too_many_rows' | 'nothing_valid';
export interface ImportFileIssue {
  code: ImportFileIssueCode;
  params: Record<string, string | number>;
}

export interface ImportRow {
  /** line in the file (the header is line 1) */
  line: number;
  raw: Record<string, string>;
  spec: OrderSpec | null;
  errors: ImportCellError[];
  warnings: ImportRowWarning[];
  /** cells a spreadsheet would run as formulas (they are imported as text) */
  formulaCells: ImportCellError[];
}

export interface ImportPreview {
  /** problems with the file as a whole (no row can be imported) */
  fileErrors: string[];
  /** the same problems as codes and values */
  fileIssues: ImportFileIssue[];
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
  const k = v
    .trim()
    .toLowerCase()
    .replace(/[\s-]+/g, '_');
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
      const name = part
        .replace(/#[0-9a-fA-F]{3,8}\b/, '')
        .replace(/\([^)]*\)/, '')
        .trim();
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

const COLUMN_WORDS: Record<ImportColumn, string> = {
  customer: 'customer',
  title: 'title',
  productType: 'product',
  process: 'process',
  material: 'material',
  sizeMm: 'size',
  quantity: 'quantity',
  overrunPct: 'overrun',
  colours: 'colours',
  plating: 'plating',
  backingType: 'fitting',
  backingCount: 'fitting count',
  backLogo: 'back logo',
  printing: 'printing',
  epoxy: 'epoxy',
  packaging: 'packaging',
  dueDate: 'due date',
  notes: 'notes',
  secondPlating: 'second finish',
  sandblast: 'sandblast',
};

const quote = (v: unknown) => `"${String(v ?? '').slice(0, 40)}"`;

/** One schema issue as a planner would say it: what the cell holds and what to write instead. */
export function describeImportIssue(
  issue: {
    code: string;
    message: string;
    path: readonly PropertyKey[];
    values?: readonly unknown[];
    expected?: string;
    minimum?: unknown;
    maximum?: unknown;
    origin?: string;
    format?: string;
  },
  column: ImportColumn | null,
  cell: string,
): Omit<ImportCellError, 'column'> {
  const what = column ? COLUMN_WORDS[column] : 'value';
  const value = cell.trim();
  const mk = (code: ImportIssueCode, message: string, params: Record<string, string | number> = {}) => ({ code, message, params: { value, ...params } });
  if (column === 'colours' && issue.path.includes('hex'))
    return mk('bad_swatch', `The swatch in ${quote(value)} is not a colour code; write it as # and six digits or letters, for example #1b2a4a.`);
  if (value === '' && (issue.code === 'too_small' || issue.code === 'invalid_type' || issue.code === 'invalid_value' || issue.code === 'invalid_format'))
    return mk('missing', `The ${what} is empty; fill it in.`);
  switch (issue.code) {
    case 'invalid_value': {
      const choices = (issue.values ?? []).map(String).join(', ');
      return mk('not_a_choice', `${quote(value)} is not a ${what} we make; write one of: ${choices}.`, { choices });
    }
    case 'invalid_type':
      if (issue.expected === 'number') return mk('not_a_number', `${quote(value)} is not a number; write the ${what} in digits.`);
      if (issue.expected === 'boolean') return mk('not_yes_no', `Write yes or no for ${what} (the file has ${quote(value)}).`);
      return mk('missing', `The ${what} is empty; fill it in.`);
    case 'invalid_format':
      return mk('not_a_date', `${quote(value)} is not a date; write it as year-month-day, for example 2026-05-29.`);
    case 'too_small':
      if (issue.origin === 'string') return mk('missing', `The ${what} is empty; fill it in.`);
      return mk('too_small', `The ${what} must be at least ${issue.minimum} (the file has ${value}).`, { min: String(issue.minimum) });
    case 'too_big':
      if (issue.origin === 'string') return mk('too_long', `The ${what} is too long: at most ${issue.maximum} characters.`, { max: String(issue.maximum) });
      return mk('too_big', `The ${what} can be at most ${issue.maximum} (the file has ${value}).`, { max: String(issue.maximum) });
    case 'invalid_union':
    case 'not_multiple_of':
      return mk('not_whole', `Write whole pieces for the ${what} (the file has ${value}).`);
    default:
      if (/whole/i.test(issue.message)) return mk('not_whole', `Write whole pieces for the ${what} (the file has ${value}).`);
      if (/colour/i.test(issue.message)) return mk('no_colour', 'An enamel order needs at least one colour; list them in the colours cell.');
      return mk('rule', `${issue.message}.`.replace(/\.\.$/, '.'));
  }
}

/** Due dates already past, or so close the order cannot be made in time: warn, do not block. */
function dueWarnings(spec: OrderSpec, today: string | undefined): ImportRowWarning[] {
  if (!today) return [];
  if (spec.dueDate < today)
    return [
      { code: 'due_in_past', message: `The due date ${spec.dueDate} has already passed; check the date before importing.`, params: { due: spec.dueDate } },
    ];
  return [];
}

/** Reads a CSV text into a preview: each row parsed, each bad cell named. Nothing is saved. */
export function previewOrderImport(csv: string, today?: string): ImportPreview {
  const fileIssues: ImportFileIssue[] = [];
  const fileErrors: string[] = [];
  const fail = (code: ImportFileIssueCode, message: string, params: Record<string, string | number> = {}) => {
    fileIssues.push({ code, params });
    fileErrors.push(message);
  };
  const text = csv.replace(/^\uFEFF/, '');
  if (text.trim() === '')
    return { fileErrors: ['The file is empty'], fileIssues: [{ code: 'empty', params: {} }], unknownColumns: [], rows: [], validCount: 0 };
  // spreadsheets in some locales save with ';' — let the parser guess between ',' ';' and tab
  const parsed = Papa.parse<string[]>(text, { skipEmptyLines: 'greedy', delimitersToGuess: [',', ';', '\t'] });
  const [header, ...body] = parsed.data;
  if (!header || header.length < 2) {
    return {
      fileErrors: ['This does not look like a CSV file with a header row'],
      fileIssues: [{ code: 'not_csv', params: {} }],
      unknownColumns: [],
      rows: [],
      validCount: 0,
    };
  }
  const columns = header.map((h) => COLUMN_BY_KEY.get(key(h)) ?? null);
  const unknownColumns = header.filter((_, i) => columns[i] === null).map((h) => h.trim());
  const missing = REQUIRED_IMPORT_COLUMNS.filter((c) => !columns.includes(c));
  if (missing.length) fail('missing_columns', `Missing columns: ${missing.join(', ')}`, { columns: missing.join(', ') });
  if (body.length === 0) fail('no_rows', 'The file has a header but no orders');
  if (body.length > MAX_IMPORT_ROWS)
    fail('too_many_rows', `At most ${MAX_IMPORT_ROWS} orders per file (this one has ${body.length})`, { max: MAX_IMPORT_ROWS, count: body.length });
  if (fileErrors.length) return { fileErrors, fileIssues, unknownColumns, rows: [], validCount: 0 };

  const rows: ImportRow[] = body.map((cells, i) => {
    const raw: Record<string, string> = {};
    columns.forEach((c, j) => {
      if (c) raw[c] = cells[j] ?? '';
    });
    const errors: ImportCellError[] = [];
    if (cells.length !== header.length) {
      errors.push({
        column: null,
        code: 'cell_count',
        params: { cells: cells.length, header: header.length },
        message: `This row has ${cells.length} cells but the header has ${header.length}; a comma inside a cell needs quotes around the cell.`,
      });
    }
    const result = orderSpecSchema.safeParse(toSpecInput(raw));
    if (!result.success) {
      for (const issue of result.error.issues) {
        const column = columnOf(issue.path);
        // one message per cell is enough for a planner
        if (!errors.some((e) => e.column === column))
          errors.push({ column, ...describeImportIssue(issue as Parameters<typeof describeImportIssue>[0], column, column ? (raw[column] ?? '') : '') });
      }
    }
    const spec = errors.length === 0 && result.success ? result.data : null;
    const formulaCells: ImportCellError[] = columns.flatMap((c, j) =>
      looksLikeFormula(cells[j] ?? '')
        ? [
            {
              column: c,
              code: 'formula' as const,
              params: { value: (cells[j] ?? '').slice(0, 40) },
              message: `"${(cells[j] ?? '').slice(0, 40)}" starts like a spreadsheet formula; it is kept as text. Check the cell in the sheet.`,
            },
          ]
        : [],
    );
    const warnings: ImportRowWarning[] = spec
      ? [...dueWarnings(spec, today), ...specWarnings(spec).map((w) => ({ code: w.code, message: w.message, params: w.params ?? {} }))]
      : [];
    return { line: i + 2, raw, spec, errors, warnings, formulaCells };
  });
  const validCount = rows.filter((r) => r.spec).length;
  if (validCount === 0) fail('nothing_valid', 'No row can be imported');
  return { fileErrors, fileIssues, unknownColumns, rows, validCount };
}
