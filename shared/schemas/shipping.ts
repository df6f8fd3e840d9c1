// Wire shapes of packing, dispatch, the customer status link and the mail outbox.
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

/** `POST /api/orders/:id/shipments` */
export const createShipmentSchema = z.object({
  carrier: carrierSchema,
  trackingNumber: trackingNumberSchema,
  cartons: z.array(cartonLineSchema).min(1, 'At least one carton').max(100),
  /** confirm a tracking number that another order already uses */
  confirmDuplicate: z.boolean().optional(),
  /** ship an under-quantity order anyway (a recorded decision) */
  acceptShort: z.boolean().optional(),
  note: z.string().trim().max(500).optional(),
});
export type CreateShipmentInput = z.input<typeof createShipmentSchema>;
export type CreateShipment = z.output<typeof createShipmentSchema>;

export const shipmentSchema = z.object({
  id: z.string(),
  orderId: z.string(),
  number: z.number().int(),
  carrier: z.string(),
  trackingNumber: z.string(),
  cartons: z.array(cartonLineSchema),
  pieces: z.number().int(),
  cartonCount: z.number().int(),
  weightKg: z.number(),
  createdAt: z.string(),
  createdBy: z.string().nullable(),
  /** other orders that carry the same tracking number */
  duplicateOf: z.array(z.string()).optional(),
});
export type Shipment = z.infer<typeof shipmentSchema>;

/** `POST /api/orders/:id/share` answer */
export const shareLinkSchema = z.object({
  token: z.string().min(22),
  url: z.string(),
});
export type ShareLink = z.infer<typeof shareLinkSchema>;

/** A status token as it appears in a URL: base64url of at least 16 random bytes. */
export const statusTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{22,128}$/);

/** `GET /api/public/status/:token`: exactly these fields and nothing else. */
export const publicStatusSchema = z.strictObject({
  title: z.string(),
  customer: z.string(),
  stage: z.string(),
  stages: z.array(z.strictObject({ name: z.string(), done: z.boolean() })),
  projectedShipAt: z.string().nullable(),
  shippedAt: z.string().optional(),
  carrier: z.string().optional(),
  trackingNumber: z.string().optional(),
});
export type PublicStatus = z.infer<typeof publicStatusSchema>;

/** `GET /api/mail` item */
export const caughtMailSchema = z.object({
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  sentAt: z.string(),
});
export type CaughtMail = z.infer<typeof caughtMailSchema>;
