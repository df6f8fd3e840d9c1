import { describe, expect, it } from 'vitest';
import { cartonLineSchema, createShipmentSchema, emailAddressSchema, publicStatusSchema, statusTokenSchema, trackingNumberSchema } from './shipping';

describe('e-mail addresses at entry', () => {
  it('accepts ordinary addresses and trims them', () => {
    expect(emailAddressSchema.parse('  buyer@northfield-rowing.example ')).toBe('buyer@northfield-rowing.example');
    expect(emailAddressSchema.safeParse('first.last+pins@sub.example.org').success).toBe(true);
  });
  it.each([
    'plainaddress',
    '@no-local-part.example',
    'no-at-sign.example',
    'two@@signs.example',
    'space in@local.example',
    'trailing-dot@example.',
    'missing-domain@',
    '',
  ])('refuses %j', (bad) => {
    expect(emailAddressSchema.safeParse(bad).success).toBe(false);
  });
  it('refuses an address longer than 254 characters (RFC 5321 path limit, RFC 3696 errata; from memory)', () => {
    const long = `${'a'.repeat(64)}@${'b'.repeat(63)}.${'c'.repeat(63)}.${'d'.repeat(63)}.example`;
    expect(long.length).toBeGreaterThan(254);
    expect(emailAddressSchema.safeParse(long).success).toBe(false);
  });
});

describe('shipment input', () => {
  it('normalises a scanned tracking number', () => {
    const s = createShipmentSchema.parse({
      carrier: ' Harbour Express ',
      trackingNumber: ']C1hx 4402 9917\r',
      cartons: [{ count: 3, piecesPerCarton: 200, weightKg: 4.2 }],
    });
    expect(s.carrier).toBe('Harbour Express');
    expect(s.trackingNumber).toBe('HX44029917');
  });
  it('refuses a tracking number with odd characters or too short', () => {
    expect(trackingNumberSchema.safeParse('AB/12345').success).toBe(false);
    expect(trackingNumberSchema.safeParse('A1').success).toBe(false);
  });
  it('needs at least one carton with whole counts and a positive weight', () => {
    expect(createShipmentSchema.safeParse({ carrier: 'X', trackingNumber: 'ABCD1234', cartons: [] }).success).toBe(false);
    expect(cartonLineSchema.safeParse({ count: 1.5, piecesPerCarton: 10, weightKg: 1 }).success).toBe(false);
    expect(cartonLineSchema.safeParse({ count: 1, piecesPerCarton: 10, weightKg: 0 }).success).toBe(false);
  });
});

describe('public status', () => {
  const ok = {
    factory: 'Tallowmere Badge Works',
    number: '1042',
    title: 'Regatta 2025 crew pins',
    customer: 'Northfield Rowing Club',
    quantity: 500,
    process: 'hard_enamel',
    stage: 'Colour',
    stages: [
      { key: 'artwork', name: 'Artwork and moulds', done: true, at: '2025-03-20T09:00:00.000Z' },
      { key: 'forming', name: 'Metal forming', done: true, at: '2025-03-24T16:00:00.000Z' },
      { key: 'colour', name: 'Colour', done: false },
    ],
    projectedShipAt: '2025-04-02T15:00:00.000Z',
    updatedAt: '2025-03-26T08:00:00.000Z',
  };
  it('accepts the documented fields', () => {
    expect(publicStatusSchema.parse(ok)).toEqual(ok);
    expect(publicStatusSchema.safeParse({ ...ok, shippedAt: '2025-04-02T10:00:00Z', carrier: 'X', trackingNumber: 'Y' }).success).toBe(true);
  });
  it('refuses any other field, top level or inside a stage', () => {
    expect(publicStatusSchema.safeParse({ ...ok, price: 10 }).success).toBe(false);
    expect(publicStatusSchema.safeParse({ ...ok, notes: 'internal' }).success).toBe(false);
    expect(publicStatusSchema.safeParse({ ...ok, stages: [{ name: 'Colour', done: false, key: 'colour', operator: 'someone' }] }).success).toBe(false);
  });
});

describe('status tokens', () => {
  it('wants at least 22 base64url characters (128 bits)', () => {
    // 16 bytes → ceil(16 × 8 / 6) = 22 base64url characters without padding (RFC 4648 §5).
    const token = Buffer.from(new Uint8Array(16).fill(255)).toString('base64url');
    expect(token).toHaveLength(22);
    expect(statusTokenSchema.safeParse(token).success).toBe(true);
    expect(statusTokenSchema.safeParse(token.slice(1)).success).toBe(false);
    expect(statusTokenSchema.safeParse(`${token.slice(1)}/`).success).toBe(false);
  });
});
