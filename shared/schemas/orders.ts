// Wire shapes of orders: the spec a planner enters, the release and payment bodies,
// and the gentle checks that warn (never block) about unusual specs.
import type { ProjectionNote } from '@shared/domain/projection-note';
import { z } from 'zod';
import type { RoutingStep, TrayPhase, TravellerKind, OrderStatus } from '@shared/domain/vocabulary';
import type { MouldTool } from '@shared/domain/routing';
import { currencySchema, type OrderPayment, type OrderPaymentSummary } from './payments';
import { BACKING_TYPES, MATERIALS, PACKAGINGS, PLATINGS, PROCESSES, type Plating, type Process } from '@shared/domain/vocabulary';

/** What the badge is; decides which size bounds apply to the warning. */
export const PRODUCT_TYPES = ['pin', 'coin', 'medal', 'key_ring'] as const;
export type ProductType = (typeof PRODUCT_TYPES)[number];

/** Processes whose colours are filled with enamel (one fill step per colour). */
export const ENAMEL_PROCESSES: readonly Process[] = ['hard_enamel', 'soft_enamel', 'die_cast_3d'];

export const OVERRUN_DEFAULT_PCT = 5;
export const OVERRUN_MAX_PCT = 10;
export const MAX_COLOURS = 24;

const isoDay = z.iso.date({ error: 'Use a date written YYYY-MM-DD' });

export const colourSchema = z.strictObject({
  name: z.string().trim().min(1, 'Name the colour').max(60),
  /** the customer's colour reference code */
  ref: z.string().trim().max(40).optional(),
  hex: z
    .string()
    .regex(/^#[0-9a-fA-F]{6}$/, 'Use a swatch written #RRGGBB')
    .optional(),
});
export type Colour = z.infer<typeof colourSchema>;

export const backingSchema = z.strictObject({
  type: z.enum(BACKING_TYPES),
  count: z.number().int().min(0).max(6),
});

/** The fields of an order spec; quotes build their spec from the same fields. */
export const orderSpecFields = {
  customer: z.string().trim().min(1).max(120).optional(),
  customerId: z.string().trim().min(1).max(64).optional(),
  title: z.string().trim().min(1, 'Give the order a title').max(160),
  productType: z.enum(PRODUCT_TYPES).default('pin'),
  process: z.enum(PROCESSES),
  material: z.enum(MATERIALS),
  /** longest side in millimetres */
  sizeMm: z.number().positive('Size must be above 0 mm').max(500),
  quantity: z.number().int('Whole pieces only').min(1).max(1_000_000),
  overrunPct: z.number().min(0).max(OVERRUN_MAX_PCT).default(OVERRUN_DEFAULT_PCT),
  colours: z.array(colourSchema).max(MAX_COLOURS).default([]),
  plating: z.enum(PLATINGS),
  /** a two-tone badge's second finish (null: one finish) */
  secondPlating: z.enum(PLATINGS).nullable().default(null),
  backing: backingSchema,
  backLogo: z.boolean().default(false),
  printing: z.boolean().default(false),
  epoxy: z.boolean().default(false),
  /** a sandblasted (matt) texture on the recessed metal */
  sandblast: z.boolean().default(false),
  packaging: z.enum(PACKAGINGS),
  dueDate: isoDay,
  notes: z.string().trim().max(4000).default(''),
  /** the agreed price of the whole order (from the accepted quote, or typed in) */
  priceTotal: z.number().positive('The price must be above 0').max(100_000_000).optional(),
  /** ISO 4217 code of the price; the payment setting's currency when not given */
  currency: currencySchema.optional(),
  /** id of an earlier order with the same artwork: the reorder reuses its stored moulds */
  reorderOf: z.string().trim().min(1).max(64).optional(),
};

type SpecShape = {
  customer?: string;
  customerId?: string;
  process: Process;
  colours: unknown[];
  plating: Plating;
  secondPlating: Plating | null;
  backLogo: boolean;
  sandblast: boolean;
};

/** Spec fields that contradict each other: each is refused on its own field, never silently ignored. */
export function specContradictions(spec: Omit<SpecShape, 'customer' | 'customerId'>): { path: string; message: string }[] {
  const out: { path: string; message: string }[] = [];
  const { process } = spec;
  if ((process === 'hard_enamel' || process === 'soft_enamel') && spec.colours.length === 0) {
    out.push({ path: 'colours', message: 'An enamel order needs at least one colour' });
  }
  if (process === 'die_struck' && spec.colours.length > 0) {
    out.push({ path: 'colours', message: 'A die-struck badge has no enamel colours: remove the colours, or choose hard or soft enamel' });
  }
  if (process === 'printed' && spec.backLogo) {
    out.push({
      path: 'backLogo',
      message: 'A printed badge is cut from a printed sheet and has no struck back logo: switch the back logo off, or choose a struck process',
    });
  }
  if (process === 'printed' && spec.sandblast) {
    out.push({ path: 'sandblast', message: 'A printed badge’s face is covered by the print: it cannot be sandblasted' });
  }
  if (spec.secondPlating != null) {
    if (spec.secondPlating === spec.plating) {
      out.push({ path: 'secondPlating', message: 'The second finish is the same as the first: choose another finish, or none' });
    } else if (process === 'printed') {
      out.push({ path: 'secondPlating', message: 'A printed badge’s face is covered by the print: it cannot have a two-tone finish' });
    }
  }
  return out;
}

/** Exactly one of customer (a name) and customerId. */
export function checkCustomer(spec: Pick<SpecShape, 'customer' | 'customerId'>, ctx: z.RefinementCtx) {
  if (!spec.customer && !spec.customerId) {
    ctx.addIssue({ code: 'custom', path: ['customer'], message: 'Pick or name a customer' });
  }
  if (spec.customer && spec.customerId) {
    ctx.addIssue({ code: 'custom', path: ['customer'], message: 'Give either customer or customerId, not both' });
  }
}

/** Spec fields that contradict each other, each refused on its own field. */
export function checkContradictions(spec: Omit<SpecShape, 'customer' | 'customerId'>, ctx: z.RefinementCtx) {
  for (const c of specContradictions(spec)) ctx.addIssue({ code: 'custom', path: [c.path], message: c.message });
}

function checkSpec(spec: SpecShape, ctx: z.RefinementCtx) {
  checkCustomer(spec, ctx);
  checkContradictions(spec, ctx);
}

/** The order spec as entered (POST /api/orders). Unknown fields are refused. */
export const orderSpecSchema = z.strictObject(orderSpecFields).superRefine(checkSpec);
export type OrderSpecInput = z.input<typeof orderSpecSchema>;
export type OrderSpec = z.output<typeof orderSpecSchema>;

/** A change to an order's spec before release: any field of the spec. */
export const orderSpecPatchSchema = z
  .strictObject({
    ...orderSpecFields,
    productType: z.enum(PRODUCT_TYPES),
    overrunPct: z.number().min(0).max(OVERRUN_MAX_PCT),
    colours: z.array(colourSchema).max(MAX_COLOURS),
    backLogo: z.boolean(),
    printing: z.boolean(),
    epoxy: z.boolean(),
    secondPlating: z.enum(PLATINGS).nullable(),
    sandblast: z.boolean(),
    notes: z.string().trim().max(4000),
  })
  .partial();
export type OrderSpecPatch = z.infer<typeof orderSpecPatchSchema>;

/** POST /api/orders/:id/release */
export const releaseBodySchema = z.strictObject({
  traySize: z.number().int().min(1).max(10_000),
  /** for an order already on the floor before the factory started using the product */
  releasedAt: z.iso.datetime({ offset: true }).optional(),
});
export type ReleaseBody = z.infer<typeof releaseBodySchema>;

export const RELEASED_AT_MAX_DAYS_BACK = 90;

/** Checks a back-dated release time against the clock: not in the future, at most 90 days back. */
export function checkReleasedAt(releasedAt: string, now: Date): string | null {
  const t = Date.parse(releasedAt);
  if (Number.isNaN(t)) return 'Not a date and time';
  // one minute of grace for clocks that differ slightly
  if (t > now.getTime() + 60_000) return 'The release time is in the future';
  if (t < now.getTime() - RELEASED_AT_MAX_DAYS_BACK * 86_400_000) {
    return `The release time is more than ${RELEASED_AT_MAX_DAYS_BACK} days back`;
  }
  return null;
}

/** POST /api/orders/:id/payment: a payment, or (managers only) a recorded exception. */
export const paymentBodySchema = z.union([
  z.strictObject({
    amount: z.number().positive('Amount must be above 0').max(100_000_000),
    /** defaults to the order's currency; a payment in another currency is refused */
    currency: currencySchema.optional(),
    reference: z.string().trim().min(1, 'Give the payment reference').max(120),
    paidOn: isoDay.optional(),
  }),
  z.strictObject({
    exception: z.literal(true),
    reason: z.string().trim().min(5, 'Say why production may start unpaid').max(500),
  }),
]);
export type PaymentBody = z.infer<typeof paymentBodySchema>;

/** POST /api/orders/:id/hold and /cancel (before release; after release holds are per tray, on the floor) */
export const orderReasonBodySchema = z.strictObject({
  reason: z.string().trim().min(3, 'Say why').max(300),
});
export type OrderReasonBody = z.infer<typeof orderReasonBodySchema>;

/** POST /api/orders/:id/proofs/:revision/approve */
export const proofApprovalBodySchema = z.strictObject({
  /** the day the customer approved; defaults to today */
  approvedOn: isoDay.optional(),
  note: z.string().trim().max(500).optional(),
});
export type ProofApprovalBody = z.infer<typeof proofApprovalBodySchema>;

// ---------------------------------------------------------------------------------------
// Warnings: unusual but allowed. The planner sees them and may go on.

export interface SpecWarning {
  field: 'sizeMm' | 'quantity' | 'material' | 'overrunPct' | 'epoxy';
  code: 'size_unusual' | 'quantity_small' | 'material_unusual' | 'epoxy_on_hard_enamel';
  message: string;
  /** the numbers in the message, for saying it in another language */
  params?: Record<string, string | number>;
}

/** Size bounds per product, longest side in mm (trade defaults: pins 10–100, coins 25–90). */
export const SIZE_BOUNDS_MM: Partial<Record<ProductType, { min: number; max: number }>> = {
  pin: { min: 10, max: 100 },
  coin: { min: 25, max: 90 },
};

/** Minimum order is about 100 pieces (common practice). */
export const USUAL_MINIMUM_QUANTITY = 100;

export function specWarnings(spec: {
  productType?: ProductType;
  sizeMm?: number;
  quantity?: number;
  process?: Process;
  material?: string;
  epoxy?: boolean;
}): SpecWarning[] {
  const warnings: SpecWarning[] = [];
  const bounds = SIZE_BOUNDS_MM[spec.productType ?? 'pin'];
  if (bounds && typeof spec.sizeMm === 'number' && (spec.sizeMm < bounds.min || spec.sizeMm > bounds.max)) {
    warnings.push({
      field: 'sizeMm',
      code: 'size_unusual',
      message: `${spec.sizeMm} mm is outside the usual ${bounds.min}–${bounds.max} mm for a ${(spec.productType ?? 'pin').replace('_', ' ')}; check the artwork`,
      params: { size: spec.sizeMm, min: bounds.min, max: bounds.max, product: spec.productType ?? 'pin' },
    });
  }
  if (typeof spec.quantity === 'number' && spec.quantity < USUAL_MINIMUM_QUANTITY) {
    warnings.push({
      field: 'quantity',
      code: 'quantity_small',
      message: `${spec.quantity} pieces is below the usual minimum of ${USUAL_MINIMUM_QUANTITY}`,
      params: { quantity: spec.quantity, minimum: USUAL_MINIMUM_QUANTITY },
    });
  }
  if (spec.process === 'die_cast_3d' && spec.material && spec.material !== 'zinc_alloy') {
    warnings.push({
      field: 'material',
      code: 'material_unusual',
      message: '3D die-cast badges are usually zinc alloy',
    });
  }
  if (spec.process === 'hard_enamel' && spec.epoxy) {
    warnings.push({
      field: 'epoxy',
      code: 'epoxy_on_hard_enamel',
      // common practice: hard enamel is stoned flush and polished, so it needs no protective dome
      message: 'Hard enamel is stoned flush and polished and is usually left without an epoxy dome; check that the customer wants one',
    });
  }
  return warnings;
}

// ---------------------------------------------------------------------------------------
// Answers

export const ORDER_GATES = ['payment_missing', 'proof_not_approved'] as const;
export type OrderGate = (typeof ORDER_GATES)[number];

export interface OrderListItem {
  id: string;
  number: string;
  customer: string;
  customerId: string;
  title: string;
  process: string;
  quantity: number;
  status: OrderStatus;
  /** the gates still open before release (empty once released) */
  openGates: OrderGate[];
  dueDate: string;
  projectedShipAt: string | null;
  late: boolean;
  releasedAt: string | null;
  trays: number;
  createdAt: string;
}

export interface OrderRoutingStep extends RoutingStep {
  /** standard minutes for a tray of the order's tray size */
  standardMinutes: number;
}

export type PaymentView = OrderPayment;

export interface ProofView {
  revision: number;
  mime: string;
  sizeBytes: number;
  originalName: string;
  uploadedBy: string;
  uploadedAt: string;
  approvedAt: string | null;
  approvedBy: string | null;
  approvalNote: string | null;
  /** the customer sent this revision back from her page */
  changesRequestedAt: string | null;
  changesComment: string | null;
}

export interface TravellerSummary {
  id: string;
  number: string;
  /** the exact text in its QR code */
  code: string;
  kind: TravellerKind;
  quantity: number;
  revision: number;
  phase: TrayPhase;
  onHold: boolean;
  stepSeq: number | null;
  stepName: string | null;
  stationKind: string | null;
  parentTrayId: string | null;
  mergedIntoId: string | null;
}

export interface OrderMouldView extends TravellerSummary {
  mouldId: string;
  mouldNumber: string;
  side: 'front' | 'back';
  /** what the traveller makes: a front or back mould, or a printed badge's cutting die */
  tool: MouldTool;
  reused: boolean;
  storageLocation: string | null;
}

export interface HistoryEntry {
  at: string;
  action: string;
  by: string | null;
  /** the line in English */
  text: string;
  /** its parameters, for screens in any language (null on lines kept before they were stored) */
  params: Record<string, string | number | boolean | string[] | null> | null;
}

export interface OrderDetail {
  id: string;
  number: string;
  customer: { id: string; name: string };
  spec: Omit<OrderSpec, 'customer' | 'customerId' | 'reorderOf'>;
  status: OrderStatus;
  holdReason: string | null;
  reorderOf: { id: string; number: string } | null;
  releasedQuantity: number;
  traySize: number | null;
  releasedAt: string | null;
  shippedAt: string | null;
  createdAt: string;
  late: boolean;
  projectedShipAt: string | null;
  /** one or two lines on how the projected date was found (English) */
  projectionNote: string | null;
  /** the same as a code and its numbers, for screens in any language */
  projectionNoteCode: ProjectionNote | null;
  warnings: SpecWarning[];
  openGates: OrderGate[];
  payments: PaymentView[];
  /** the sum of the payments recorded, in the order's currency */
  paidTotal: number;
  /** the price, the deposit share and what is still due before release */
  payment: OrderPaymentSummary;
  proofs: ProofView[];
  routing: OrderRoutingStep[];
  mouldRouting: RoutingStep[];
  /** a new design needs front (and back) moulds engraved, or a cutting die made; a reorder reuses stored ones */
  mouldPlan: { side: 'front' | 'back'; tool: MouldTool; reuse: boolean; mouldNumber: string | null }[];
  trays: TravellerSummary[];
  moulds: OrderMouldView[];
  history: HistoryEntry[];
}

export interface ReleasedTraveller {
  id: string;
  number: string;
  code: string;
  quantity: number;
}

export interface ReleaseResult {
  trays: ReleasedTraveller[];
  moulds: ReleasedTraveller[];
}

export const importBodySchema = z.strictObject({
  csv: z.string().max(1024 * 1024),
});
