import type { Api } from '../http/api';
import { ADMIN_ONLY, SALES_VIEW } from '@shared/domain/access';
import { paymentSettingsSchema } from '@shared/schemas/payments';
import { paymentsService } from '../services/payments.service';

export function registerPaymentRoutes(api: Api) {
  // Posted by the payment service (or the local fake), never by a browser: public, and exempt
  // from the same-origin rule only because the handler verifies the Stripe-Signature header over
  // the raw body before anything is read or changed (decision 0011).
  api.route({
    method: 'post',
    path: '/payments/webhook',
    access: 'public',
    origin: 'signed',
    handler: ({ deps, req }) => paymentsService.webhook(deps, req.body, req.get('stripe-signature')),
  });
  api.route({ method: 'get', path: '/payment-settings', access: { roles: SALES_VIEW }, handler: ({ deps }) => paymentsService.settings(deps) });
  api.route({
    method: 'put',
    path: '/admin/payment-settings',
    access: { roles: ADMIN_ONLY },
    body: paymentSettingsSchema,
    handler: ({ deps, body, user }) => paymentsService.saveSettings(deps, body, user!.id),
  });
}
