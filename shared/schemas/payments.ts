// Wire shapes of payments, the hosted checkout and the order side of the customer's page.
import { z } from 'zod';
import { DEFAULT_CURRENCY, DEFAULT_DEPOSIT_PCT, THREE_DECIMAL_CURRENCIES } from '@shared/domain/payments';

export const currencySchema = z
  .string()
  .trim()
  .transform((s) => s.toUpperCase())
  .pipe(
    z
      .string()
      .regex(/^[A-Z]{3}$/, 'Use a three-letter currency code (ISO 4217), for example EUR')
      .refine((c) => !THREE_DECIMAL_CURRENCIES.has(c), 'Payments in a three-decimal currency are not supported'),
  );

/** Admin setting: the share of the price paid before production, and the currency of orders typed in by hand. */
export const paymentSettingsSchema = z.strictObject({
  depositPct: z.number().min(1, 'At least 1 %').max(100, 'At most 100 %'),
  currency: currencySchema,
});
export type PaymentSettings = z.infer<typeof paymentSettingsSchema>;
export const DEFAULT_PAYMENT_SETTINGS: PaymentSettings = { depositPct: DEFAULT_DEPOSIT_PCT, currency: DEFAULT_CURRENCY };

/** One payment as `GET /api/orders/:id` lists it. */
export interface OrderPayment {
  id: string;
  amount: number | null;
  currency: string | null;
  reference: string;
  source: 'manual' | 'checkout';
  at: string;
  isException: boolean;
  note: string;
  /** who typed it in; the payment service for a checkout payment */
  recordedBy: string;
  recordedAt: string;
}

export interface OrderPaymentSummary {
  priceTotal: number | null;
  currency: string;
  depositPct: number;
  /** what must be paid before release; null without an agreed price */
  required: number | null;
  paidTotal: number;
  amountDue: number | null;
}

/** `POST /api/public/orders/:token/proofs/:revision/approve` */
export const portalApproveBodySchema = z.strictObject({
  name: z.string().trim().min(2, 'Type your name to approve').max(120),
});
export type PortalApproveBody = z.infer<typeof portalApproveBodySchema>;

/** `POST /api/public/orders/:token/proofs/:revision/changes` */
export const portalChangesBodySchema = z.strictObject({
  comment: z.string().trim().min(3, 'Say what should change').max(2000),
});
export type PortalChangesBody = z.infer<typeof portalChangesBodySchema>;

export const portalProofParamsSchema = z.object({
  token: z.string().max(200),
  revision: z.coerce.number().int().min(1).max(10_000),
});

/** `POST /api/public/orders/:token/checkout` */
export interface CheckoutAnswer {
  url: string;
}

/** `PATCH /api/photos/:id` (supervisor): show a QC photo to the customer or not */
export const photoShareBodySchema = z.strictObject({ shareable: z.boolean() });

/** `GET /api/trays/:id/photos`: a tray's QC photos on the supervisor's view */
export interface TrayPhotoView {
  id: string;
  url: string;
  mime: string;
  stationKind: string | null;
  takenAt: string;
  shareable: boolean;
  sharedAt: string | null;
}
