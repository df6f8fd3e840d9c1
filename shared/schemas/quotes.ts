// Wire shapes of quotes: the spec is the order spec (same fields, same checks) without the
// quantity and due date, plus the part's height and thickness for costing.
import { z } from 'zod';
import { checkContradictions, checkCustomer, orderSpecFields } from '@shared/schemas/orders';
import { emailAddressSchema } from '@shared/schemas/shipping';
import type { CostBreakdown, MouldCost, StepCost } from '@shared/domain/costing';

export const MAX_QUANTITY_BREAKS = 6;

const isoDay = z.iso.date({ error: 'Use a date written YYYY-MM-DD' });

// eslint-disable-next-line @typescript-eslint/no-unused-vars
const { quantity, dueDate, customer, customerId, priceTotal, currency, ...quoteSpecFields } = orderSpecFields;

export const quoteSpecSchema = z
  .strictObject({
    ...quoteSpecFields,
    /** the other side of the bounding box (sizeMm is the longest side) */
    heightMm: z.number().positive('Height must be above 0 mm').max(500),
    thicknessMm: z.number().positive('Thickness must be above 0 mm').max(20, 'Thicker than 20 mm is not a badge'),
    /** outline area ÷ bounding-box area (a disc is 0.785); the factory's default when absent */
    outlineFactor: z.number().min(0.1, 'At least 0.1').max(1, 'At most 1: the outline fits in its box').optional(),
  })
  .superRefine((spec, ctx) => {
    checkContradictions(spec, ctx);
    if (spec.heightMm > spec.sizeMm) {
      ctx.addIssue({ code: 'custom', path: ['heightMm'], message: 'The size is the longest side: the height cannot be larger' });
    }
  });
export type QuoteSpecInput = z.input<typeof quoteSpecSchema>;
export type QuoteSpec = z.output<typeof quoteSpecSchema>;

export const quantityBreaksSchema = z
  .array(z.number().int('Whole pieces only').min(1, 'At least one piece').max(1_000_000))
  .min(1, 'Give at least one quantity')
  .max(MAX_QUANTITY_BREAKS, `At most ${MAX_QUANTITY_BREAKS} quantities`)
  .superRefine((qs, ctx) => {
    for (let i = 1; i < qs.length; i++) {
      if (qs[i] <= qs[i - 1]) ctx.addIssue({ code: 'custom', path: [i], message: 'Quantities go up from left to right' });
    }
  });

const quoteFields = {
  customer: z.string().trim().min(1).max(120).optional(),
  customerId: z.string().trim().min(1).max(64).optional(),
  contactName: z.string().trim().max(120).optional(),
  contactEmail: emailAddressSchema,
  spec: quoteSpecSchema,
  quantities: quantityBreaksSchema,
  validUntil: isoDay,
  /** notes to the customer, printed on the quote */
  notes: z.string().trim().max(4000).default(''),
};

/** POST /api/quotes, and PUT /api/quotes/:id (a new version). */
export const quoteBodySchema = z.strictObject(quoteFields).superRefine(checkCustomer);
export type QuoteBodyInput = z.input<typeof quoteBodySchema>;
export type QuoteBody = z.output<typeof quoteBodySchema>;

/** POST /api/public/quotes/:token/accept */
export const acceptQuoteBodySchema = z.strictObject({
  quantity: z.number().int().min(1).max(1_000_000),
  name: z.string().trim().min(2, 'Write your name').max(120),
});
export type AcceptQuoteBody = z.infer<typeof acceptQuoteBodySchema>;

export const QUOTE_STATUSES = ['draft', 'sent', 'accepted', 'expired'] as const;
export type QuoteStatus = (typeof QUOTE_STATUSES)[number];

export interface QuoteShipDates {
  /** expected ship date of this break (ISO), null when it cannot be projected */
  expectedAt: string | null;
  /** 85th-percentile ship date (ISO) */
  p85At: string | null;
}

export interface QuoteLineView {
  quantity: number;
  madePieces: number;
  unitPrice: number;
  goodsTotal: number;
  mouldCharge: number;
  total: number;
  unitCost: number;
  breakdown: CostBreakdown;
  steps: StepCost[];
  ovenCycles: number;
  shipDates: QuoteShipDates;
}

export interface QuoteVersionSummary {
  version: number;
  createdAt: string;
  createdBy: string | null;
  quantities: number[];
  validUntil: string;
}

export interface QuoteView {
  id: string;
  number: string;
  version: number;
  status: QuoteStatus;
  customer: { id: string; name: string };
  contactName: string | null;
  contactEmail: string;
  spec: QuoteSpec;
  quantities: number[];
  validUntil: string;
  notes: string;
  currency: string;
  materialGrams: number;
  platedDm2: number;
  moulds: MouldCost[];
  mouldCharge: number;
  lines: QuoteLineView[];
  /** how the ship dates were found */
  shipDateBasis: string;
  versions: QuoteVersionSummary[];
  sentAt: string | null;
  accepted: { orderId: string; orderNumber: string; quantity: number; version: number; name: string; at: string } | null;
  links: { id: string; createdAt: string; revokedAt: string | null; lastOpenedAt: string | null }[];
  createdAt: string;
  updatedAt: string;
}

export interface QuoteListItem {
  id: string;
  number: string;
  version: number;
  status: QuoteStatus;
  customer: string;
  title: string;
  process: string;
  quantities: number[];
  validUntil: string;
  currency: string;
  /** total of the smallest break */
  fromTotal: number | null;
  orderNumber: string | null;
  updatedAt: string;
}

/** GET /api/public/quotes/:token: what the customer sees. No costs, no breakdown. */
export const publicQuoteSchema = z.strictObject({
  factory: z.string(),
  number: z.string(),
  version: z.number(),
  status: z.enum(QUOTE_STATUSES),
  customer: z.string(),
  contactName: z.string().nullable(),
  title: z.string(),
  spec: z.strictObject({
    process: z.string(),
    material: z.string(),
    sizeMm: z.number(),
    heightMm: z.number(),
    thicknessMm: z.number(),
    colours: z.array(z.strictObject({ name: z.string(), ref: z.string().optional(), hex: z.string().optional() })),
    plating: z.string(),
    backing: z.strictObject({ type: z.string(), count: z.number() }),
    backLogo: z.boolean(),
    printing: z.boolean(),
    epoxy: z.boolean(),
    packaging: z.string(),
    overrunPct: z.number(),
  }),
  currency: z.string(),
  lines: z.array(
    z.strictObject({
      quantity: z.number(),
      unitPrice: z.number(),
      goodsTotal: z.number(),
      mouldCharge: z.number(),
      total: z.number(),
      expectedShipAt: z.string().nullable(),
      p85ShipAt: z.string().nullable(),
    }),
  ),
  mouldCharge: z.number(),
  validUntil: z.string(),
  notes: z.string(),
  accepted: z.strictObject({ quantity: z.number(), name: z.string(), at: z.string(), orderNumber: z.string() }).nullable(),
});
export type PublicQuote = z.infer<typeof publicQuoteSchema>;

export interface AcceptQuoteResult {
  orderId: string;
  number: string;
  statusToken: string;
}

/** GET /api/reports/costing: quoted against actual by process and colour count */
export interface CostingReportRow {
  process: string;
  colours: number;
  orders: number;
  quoted: number;
  actual: number;
  variance: number;
  variancePct: number | null;
}

export const costingReportQuerySchema = z.object({
  from: isoDay.optional(),
  to: isoDay.optional(),
});
