// Wire shapes of packing, dispatch, the customer status link and the mail outbox.
import type { ProjectionNote } from '@shared/domain/projection-note';
import type { StageNote } from '@shared/domain/stages';
import { z } from 'zod';
import { normaliseTrackingNumber } from '@shared/domain/shipping';

/** An e-mail address as entered by a person: trimmed, lower-cased domain is left as typed. */
export const emailAddressSchema = z
  .string()
  .trim()
  .max(254, 'An e-mail address has at most 254 characters')
  .pipe(z.email({ message: 'Not a valid e-mail address' }));
export type EmailAddress = z.infer<typeof emailAddressSchema>;

export const cartonLineSchema = z.object({
  count: z.number().int().min(1).max(10_000),
  piecesPerCarton: z.number().int().min(1).max(1_000_000),
  weightKg: z.number().positive().max(1_000),
});
export type CartonLineInput = z.infer<typeof cartonLineSchema>;

export const trackingNumberSchema = z
  .string()
  .max(200)
  .transform(normaliseTrackingNumber)
  .pipe(
    z
      .string()
      .min(4, 'A tracking number has at least 4 characters')
      .max(40, 'A tracking number has at most 40 characters')
      .regex(/^[A-Z0-9-]+$/, 'A tracking number has only letters, digits and dashes'),
  );

export const carrierSchema = z.string().trim().min(1, 'Name the carrier').max(60);

/** A carton in a shipment: a new carton line, or one already packed (by its id). */
export const shipmentCartonSchema = z.union([cartonLineSchema, z.object({ cartonId: z.string().min(1) })]);
export type ShipmentCartonInput = z.infer<typeof shipmentCartonSchema>;

/** `POST /api/orders/:id/cartons`: cartons packed and waiting for dispatch */
export const packCartonsSchema = z.object({
  cartons: z.array(cartonLineSchema).min(1, 'At least one carton').max(100),
});
export type PackCartonsInput = z.infer<typeof packCartonsSchema>;

/** `POST /api/orders/:id/shipments` */
export const createShipmentSchema = z.object({
  carrier: carrierSchema,
  trackingNumber: trackingNumberSchema,
  cartons: z.array(shipmentCartonSchema).min(1, 'At least one carton').max(100),
  /** confirm a tracking number that another order already uses */
  confirmDuplicate: z.boolean().optional(),
  /** ship an under-quantity order anyway (a recorded decision) */
  acceptShort: z.boolean().optional(),
  note: z.string().trim().max(500).optional(),
});
export type CreateShipmentInput = z.input<typeof createShipmentSchema>;
export type CreateShipment = z.output<typeof createShipmentSchema>;

export interface CartonView {
  id: string;
  count: number;
  piecesPerCarton: number;
  weightKg: number | null;
  shipmentId: string | null;
  createdAt: string;
}

export interface ShipmentView {
  id: string;
  orderId: string;
  number: number;
  carrier: string;
  trackingNumber: string;
  pieces: number;
  cartonCount: number;
  weightKg: number;
  cartons: CartonView[];
  shippedAt: string;
  shortAccepted: boolean;
  note: string | null;
  createdBy: string | null;
  /** numbers of other orders that carry the same tracking number */
  sharedWith: string[];
}

export interface TrayOnFloor {
  id: string;
  number: string;
  quantity: number;
  phase: string;
  stationKind: string | null;
  stepName: string | null;
  onHold: boolean;
}

export interface QuantityCheckView {
  verdict: 'under' | 'ok' | 'over_allowance';
  ordered: number;
  overrunPct: number;
  maxExpected: number;
  /** good pieces at packing or beyond */
  finished: number;
  /** pieces still on the floor (may still shrink) */
  onFloor: number;
  /** finished + on the floor: what the order can still reach */
  reachable: number;
  shipped: number;
  /** finished, not yet in a shipment */
  availableToShip: number;
  /** in packed cartons that are not shipped yet */
  inCartons: number;
  shortBy: number;
  overBy: number;
  needsDecision: boolean;
  /** a shipment already recorded the decision to ship short */
  shortAccepted: boolean;
}

/** `GET /api/orders/:id/packing` */
export interface PackingView {
  order: { id: string; number: string; title: string; customer: string; status: string; quantity: number; dueDate: string };
  quantities: QuantityCheckView;
  packedTrays: TrayOnFloor[];
  onFloor: TrayOnFloor[];
  cartons: CartonView[];
  shipments: ShipmentView[];
  shipped: boolean;
  shippedAt: string | null;
}

/** `GET /api/dispatch/orders?q=`: orders with pieces for packing or dispatch */
export interface DispatchRow {
  id: string;
  number: string;
  customer: string;
  title: string;
  dueDate: string;
  status: string;
  ordered: number;
  finished: number;
  onFloor: number;
  shipped: number;
  inCartons: number;
  availableToShip: number;
  needsDecision: boolean;
}

/** answer of `POST /api/orders/:id/shipments` */
export interface CreatedShipment extends ShipmentView {
  /** mail queued for the shipped message, and who was left out (no address) */
  mail: { queued: number; missing: string[] };
}

/** `POST /api/orders/:id/share` answer */
export const shareLinkSchema = z.object({
  token: z.string().min(22),
  url: z.string(),
});
export type ShareLink = z.infer<typeof shareLinkSchema>;

/** A status token as it appears in a URL: base64url of at least 16 random bytes. */
/** `POST /api/orders/:id/share`: optionally a link that stops working after some days */
export const shareLinkBodySchema = z.strictObject({
  validDays: z.number().int().min(1).max(730).optional(),
});

export const statusTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{22,128}$/);

/** `GET /api/public/status/:token`: exactly these fields and nothing else. */
export const publicStatusSchema = z.strictObject({
  /** the factory's name */
  factory: z.string(),
  number: z.string(),
  title: z.string(),
  customer: z.string(),
  quantity: z.number(),
  /** the process, for the page's plain-words story */
  process: z.string(),
  stage: z.string(),
  /** `key` names the stage for translation; `at` is when it was finished */
  stages: z.array(z.strictObject({ key: z.string(), name: z.string(), done: z.boolean(), at: z.string().optional() })),
  /** the customer's production story: stages begun, how each is done for her process, shared photos */
  story: z
    .array(
      z.strictObject({
        stage: z.string(),
        name: z.string(),
        at: z.string(),
        doneAt: z.string().optional(),
        text: z.string(),
        textZh: z.string(),
        photos: z.array(z.string()),
      }),
    )
    .optional(),
  projectedShipAt: z.string().nullable(),
  updatedAt: z.string(),
  /** where the customer writes to the factory about this order (its order mail address) */
  contact: z.string().optional(),
  shippedAt: z.string().optional(),
  carrier: z.string().optional(),
  trackingNumber: z.string().optional(),
  /** the carrier's public tracking page, when the carrier is one we know */
  trackingUrl: z.string().optional(),
});
export type PublicStatus = z.infer<typeof publicStatusSchema>;

/** `GET /api/public/orders/:token`: the public status, what is due and the proofs; nothing else. */
export const publicOrderSchema = publicStatusSchema.extend({
  /** where the order stands before release: payment, then proof approval */
  status: z.enum(['awaiting_payment', 'awaiting_proof', 'ready', 'in_production', 'shipped', 'on_hold', 'cancelled']),
  priceTotal: z.number().nullable(),
  currency: z.string(),
  depositPct: z.number(),
  paidTotal: z.number(),
  /** still to pay before production; null while no price is agreed */
  amountDue: z.number().nullable(),
  canPay: z.boolean(),
  proofs: z.array(
    z.strictObject({
      revision: z.number(),
      fileUrl: z.string(),
      thumbnailUrl: z.string().optional(),
      mime: z.string(),
      uploadedAt: z.string(),
      approvedAt: z.string().optional(),
      approvedByName: z.string().optional(),
      changesRequestedAt: z.string().optional(),
      changesComment: z.string().optional(),
      latest: z.boolean(),
    }),
  ),
});
export type PublicOrder = z.infer<typeof publicOrderSchema>;

/** `PUT /api/orders/:id/contact`: who hears about the order */
export const orderContactSchema = z.object({
  contactName: z.string().trim().max(120).optional(),
  contactEmail: emailAddressSchema,
  salesOwnerId: z.string().min(1).nullable().optional(),
});
export type OrderContactInput = z.infer<typeof orderContactSchema>;

/** `GET /api/sales/orders?q=` */
export const salesSearchQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});

export interface StageLine {
  name: string;
  done: boolean;
}

export interface SalesOrderRow {
  id: string;
  number: string;
  customer: string;
  title: string;
  quantity: number;
  status: string;
  dueDate: string;
  stage: string;
  /** where it stands in plain words (English) */
  stageText: string;
  /** the same as a code and its numbers, for screens in any language */
  stageTextCode: StageNote;
  projectedShipAt: string | null;
  late: boolean;
  shippedAt: string | null;
  trackingNumbers: string[];
}

export const SALES_HISTORY_CODES = [
  'entered',
  'payment',
  'payment_exception',
  'proof_uploaded',
  'proof_approved',
  'released',
  'started',
  'tray_hold',
  'tray_release',
  'tray_scrap',
  'shipment',
  'pack',
  'unpack',
  'link_for_mail',
  'link_made',
  'links_withdrawn',
  'contact',
  'proof_sent',
  'packed',
  'shipped',
] as const;
export type SalesHistoryCode = (typeof SALES_HISTORY_CODES)[number];

export interface HistoryEntry {
  at: string;
  /** the line in English */
  what: string;
  /** the same as a code and its parameters, for screens in any language */
  code: SalesHistoryCode;
  params: Record<string, string | number | boolean | null>;
  who: string | null;
}

/** Why a customer link was made: by a person, for the shipped mail, sent with a quote, or when a quote was accepted. */
export type ShareLinkPurpose = 'manual' | 'shipped_mail' | 'quote' | 'quote_accepted';

export interface ShareLinkInfo {
  id: string;
  purpose: ShareLinkPurpose;
  createdAt: string;
  createdBy: string | null;
  revokedAt: string | null;
  lastOpenedAt: string | null;
}

/** `GET /api/sales/orders/:id` */
export interface SalesOrderDetail extends SalesOrderRow {
  stages: StageLine[];
  /** how the ship date is found (English) */
  projectionNote: string;
  /** the same as a code and its numbers, for screens in any language */
  projectionNoteCode: ProjectionNote;
  overrunPct: number;
  contact: { customerId: string; contactName: string | null; contactEmail: string | null };
  salesOwner: { id: string; name: string; email: string } | null;
  quantities: QuantityCheckView | null;
  shipments: ShipmentView[];
  shareLinks: ShareLinkInfo[];
  proofs: { revision: number; approvedAt: string | null; uploadedAt: string }[];
  history: HistoryEntry[];
}

/** `GET /api/mail` item */
export const caughtMailSchema = z.object({
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  sentAt: z.string(),
  id: z.string().optional(),
  from: z.string().optional(),
  html: z.string().optional(),
  attachments: z.array(z.object({ filename: z.string(), contentType: z.string(), size: z.number() })).optional(),
});
export type CaughtMail = z.infer<typeof caughtMailSchema>;

export interface MailQueueItem {
  id: string;
  kind: string;
  to: string;
  subject: string;
  status: 'queued' | 'sent' | 'failed';
  attempts: number;
  nextAttemptAt: string;
  lastError: string | null;
  createdAt: string;
  sentAt: string | null;
}

/** `POST /api/orders/:id/proofs/:revision/send` */
export const proofRevisionParamsSchema = z.object({ id: z.string().min(1), revision: z.coerce.number().int().min(1) });
