import { describe, expect, it } from 'vitest';
import { checkReleasedAt, orderSpecSchema, paymentBodySchema, releaseBodySchema, specWarnings, type OrderSpecInput } from './orders';

const base: OrderSpecInput = {
  customer: 'Harbour Rowing Club',
  title: 'Club crest 25 mm',
  process: 'hard_enamel',
  material: 'iron',
  sizeMm: 25,
  quantity: 500,
  colours: [{ name: 'Navy', ref: 'C-281', hex: '#1b2a4a' }, { name: 'White' }],
  plating: 'gold',
  backing: { type: 'butterfly_clutch', count: 1 },
  packaging: 'individual_bag',
  dueDate: '2026-04-30',
};

describe('order spec', () => {
  it('fills the defaults: 5 % overrun (common practice), no back logo, printing or epoxy', () => {
    const spec = orderSpecSchema.parse(base);
    expect(spec.overrunPct).toBe(5);
    expect(spec).toMatchObject({ backLogo: false, printing: false, epoxy: false, notes: '', productType: 'pin' });
  });

  it('refuses unknown fields', () => {
    const r = orderSpecSchema.safeParse({ ...base, colour: 'red' });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].code).toBe('unrecognized_keys');
  });

  it('overrun 0–10 % (common practice range)', () => {
    expect(orderSpecSchema.safeParse({ ...base, overrunPct: 0 }).success).toBe(true);
    expect(orderSpecSchema.safeParse({ ...base, overrunPct: 10 }).success).toBe(true);
    expect(orderSpecSchema.safeParse({ ...base, overrunPct: 10.5 }).success).toBe(false);
    expect(orderSpecSchema.safeParse({ ...base, overrunPct: -1 }).success).toBe(false);
  });

  it('needs a customer name or id, not both', () => {
    const { customer: _c, ...noCustomer } = base;
    void _c;
    expect(orderSpecSchema.safeParse(noCustomer).success).toBe(false);
    expect(orderSpecSchema.safeParse({ ...noCustomer, customerId: 'c1' }).success).toBe(true);
    expect(orderSpecSchema.safeParse({ ...base, customerId: 'c1' }).success).toBe(false);
  });

  it('checks dates, swatches, enums and whole quantities', () => {
    expect(orderSpecSchema.safeParse({ ...base, dueDate: '2026-02-30' }).success).toBe(false);
    expect(orderSpecSchema.safeParse({ ...base, dueDate: '30/04/2026' }).success).toBe(false);
    expect(orderSpecSchema.safeParse({ ...base, colours: [{ name: 'Red', hex: 'red' }] }).success).toBe(false);
    expect(orderSpecSchema.safeParse({ ...base, plating: 'chrome_velvet' }).success).toBe(false);
    expect(orderSpecSchema.safeParse({ ...base, quantity: 10.5 }).success).toBe(false);
    expect(orderSpecSchema.safeParse({ ...base, backing: { type: 'magnet', count: 1, glue: true } }).success).toBe(false);
  });

  it('an enamel order needs a colour; a plain die-struck one does not', () => {
    expect(orderSpecSchema.safeParse({ ...base, colours: [] }).success).toBe(false);
    expect(orderSpecSchema.safeParse({ ...base, process: 'die_struck', colours: [] }).success).toBe(true);
  });

  it('one finish, no texture by default', () => {
    expect(orderSpecSchema.parse(base)).toMatchObject({ secondPlating: null, sandblast: false });
  });
});

describe('contradictory specs are refused on the field that contradicts (common practice)', () => {
  const issues = (input: Partial<OrderSpecInput>) => {
    const r = orderSpecSchema.safeParse({ ...base, ...input });
    return r.success ? [] : r.error.issues.map((i) => i.path.join('.'));
  };
  it('die-struck (plain metal) with colours', () => {
    expect(issues({ process: 'die_struck' })).toEqual(['colours']);
  });
  it('hard or soft enamel with no colour', () => {
    expect(issues({ process: 'hard_enamel', colours: [] })).toEqual(['colours']);
    expect(issues({ process: 'soft_enamel', colours: [] })).toEqual(['colours']);
    // a 3D die-cast badge may be plain metal
    expect(issues({ process: 'die_cast_3d', material: 'zinc_alloy', colours: [] })).toEqual([]);
  });
  it('a second finish equal to the first', () => {
    expect(issues({ plating: 'gold', secondPlating: 'gold' })).toEqual(['secondPlating']);
    expect(issues({ plating: 'gold', secondPlating: 'black_nickel' })).toEqual([]);
  });
  it('a printed badge with a back logo, a sandblasted face or a second finish', () => {
    expect(issues({ process: 'printed', backLogo: true })).toEqual(['backLogo']);
    expect(issues({ process: 'printed', sandblast: true })).toEqual(['sandblast']);
    expect(issues({ process: 'printed', secondPlating: 'nickel' })).toEqual(['secondPlating']);
    expect(issues({ process: 'printed', epoxy: false })).toEqual([]);
  });
  it('each contradiction on its own field, all at once', () => {
    expect(issues({ process: 'printed', backLogo: true, sandblast: true, secondPlating: 'gold' }).sort()).toEqual(['backLogo', 'sandblast', 'secondPlating']);
  });
});

describe('hard enamel with an epoxy dome: warned, allowed', () => {
  it('warns on the epoxy field and still parses', () => {
    expect(orderSpecSchema.safeParse({ ...base, epoxy: true }).success).toBe(true);
    expect(specWarnings({ process: 'hard_enamel', epoxy: true })).toEqual([expect.objectContaining({ field: 'epoxy', code: 'epoxy_on_hard_enamel' })]);
    expect(specWarnings({ process: 'soft_enamel', epoxy: true })).toEqual([]);
    expect(specWarnings({ process: 'hard_enamel', epoxy: false })).toEqual([]);
  });
});

describe('size warnings: pins 10–100 mm, coins 25–90 mm (trade defaults; warn, never block)', () => {
  it('warns outside the bounds and stays quiet inside', () => {
    expect(specWarnings({ productType: 'pin', sizeMm: 25 })).toEqual([]);
    expect(specWarnings({ productType: 'pin', sizeMm: 10 })).toEqual([]);
    expect(specWarnings({ productType: 'pin', sizeMm: 100 })).toEqual([]);
    expect(specWarnings({ productType: 'pin', sizeMm: 9.5 })[0]).toMatchObject({ field: 'sizeMm', code: 'size_unusual' });
    expect(specWarnings({ productType: 'pin', sizeMm: 101 })[0].code).toBe('size_unusual');
    expect(specWarnings({ productType: 'coin', sizeMm: 24 })[0].code).toBe('size_unusual');
    expect(specWarnings({ productType: 'coin', sizeMm: 91 })[0].code).toBe('size_unusual');
    expect(specWarnings({ productType: 'coin', sizeMm: 40 })).toEqual([]);
    // a 15 mm coin is unusual, a 15 mm pin is not
    expect(specWarnings({ productType: 'coin', sizeMm: 15 })).toHaveLength(1);
    expect(specWarnings({ productType: 'pin', sizeMm: 15 })).toHaveLength(0);
  });

  it('an unusual size still parses', () => {
    expect(orderSpecSchema.safeParse({ ...base, sizeMm: 150 }).success).toBe(true);
  });

  it('warns below the usual minimum of about 100 pieces and for non-zinc 3D die-cast (common practice)', () => {
    expect(specWarnings({ quantity: 50 })[0].code).toBe('quantity_small');
    expect(specWarnings({ quantity: 100 })).toEqual([]);
    expect(specWarnings({ process: 'die_cast_3d', material: 'iron' })[0].code).toBe('material_unusual');
    expect(specWarnings({ process: 'die_cast_3d', material: 'zinc_alloy' })).toEqual([]);
  });
});

describe('release, payment', () => {
  it('release needs a whole tray size; releasedAt is optional ISO time', () => {
    expect(releaseBodySchema.safeParse({ traySize: 100 }).success).toBe(true);
    expect(releaseBodySchema.safeParse({ traySize: 0 }).success).toBe(false);
    expect(releaseBodySchema.safeParse({ traySize: 100, releasedAt: '2026-03-01T07:30:00Z' }).success).toBe(true);
    expect(releaseBodySchema.safeParse({ traySize: 100, releasedAt: 'yesterday' }).success).toBe(false);
    expect(releaseBodySchema.safeParse({ traySize: 100, extra: 1 }).success).toBe(false);
  });

  it('a back-dated release is at most 90 days back and never in the future', () => {
    const now = new Date('2026-06-01T12:00:00Z');
    expect(checkReleasedAt('2026-05-01T08:00:00Z', now)).toBeNull();
    expect(checkReleasedAt('2026-03-03T12:00:00Z', now)).toBeNull(); // 90 days exactly
    expect(checkReleasedAt('2026-03-03T11:59:00Z', now)).toMatch(/90 days/);
    expect(checkReleasedAt('2026-06-01T13:00:00Z', now)).toMatch(/future/);
  });

  it('payment or a recorded exception', () => {
    expect(paymentBodySchema.safeParse({ amount: 1250.5, reference: 'BT-0042' }).success).toBe(true);
    expect(paymentBodySchema.safeParse({ amount: 0, reference: 'x' }).success).toBe(false);
    expect(paymentBodySchema.safeParse({ exception: true, reason: 'Long-standing customer, pays on delivery' }).success).toBe(true);
    expect(paymentBodySchema.safeParse({ exception: true, reason: '' }).success).toBe(false);
  });
});
