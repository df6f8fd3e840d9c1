// The order side of the customer's page, reached with the status link's token and no sign-in:
// what she owes and pays, her proofs to approve or send back, and her own production story.
// Payments and approvals made here go through the same functions as those staff record by hand.
import type { AppDeps } from '../app-deps';
import { ordersRepository } from '../repositories/orders.repository';
import { portalRepository } from '../repositories/portal.repository';
import { shippingRepository } from '../repositories/shipping.repository';
import { AppError, notFound } from '../errors';
import { readFile, readThumbnail } from '../lib/file-store';
import { proofChangesMail } from '../lib/mail-templates';
import { publicStatusOf, resolveLink, statusUrl } from './share-links.service';
import { approveProofIn, paymentGateOf, requestProofChangesIn } from './order-gates';
import { paymentsService } from './payments.service';
import { enqueueMail, kickMail } from './mail.service';
import { notifyFloorChanged } from './live-bus';
import { publicOrderSchema, type PublicOrder } from '@shared/schemas/shipping';
import type { CheckoutAnswer } from '@shared/schemas/payments';
import { iso } from '@shared/domain/time-zone';

function portalStatus(order: { status: string; releasedAt: number | null }, shipped: boolean): PublicOrder['status'] {
  if (order.status === 'cancelled') return 'cancelled';
  if (shipped) return 'shipped';
  if (order.status === 'on_hold') return 'on_hold';
  if (order.releasedAt != null) return 'in_production';
  if (order.status === 'awaiting_payment') return 'awaiting_payment';
  if (order.status === 'awaiting_proof') return 'awaiting_proof';
  return 'ready';
}

export const portalService = {
  order(deps: AppDeps, token: string): PublicOrder {
    const { link, order } = resolveLink(deps, token);
    const status = publicStatusOf(deps, token, link, order);
    const row = ordersRepository.byId(deps.db, order.id)!;
    const gate = paymentGateOf(deps.db, row);
    const proofs = ordersRepository.proofs(deps.db, order.id);
    const base = `/api/public/orders/${encodeURIComponent(token)}/proofs`;
    const state = portalStatus(row, status.shippedAt != null);
    return publicOrderSchema.parse({
      ...status,
      status: state,
      priceTotal: row.priceTotal,
      currency: gate.currency,
      depositPct: gate.depositPct,
      paidTotal: gate.paidTotal,
      amountDue: gate.amountDue,
      canPay: !!deps.payments && gate.amountDue != null && gate.amountDue > 0 && state !== 'cancelled' && state !== 'on_hold',
      proofs: proofs.map((p, i) => ({
        revision: p.revision,
        fileUrl: `${base}/${p.revision}/file`,
        ...(readThumbnail(deps.env.dataDir, p.fileHash) ? { thumbnailUrl: `${base}/${p.revision}/thumbnail` } : {}),
        mime: p.mime,
        uploadedAt: iso(p.uploadedAt)!,
        ...(p.approvedAt != null ? { approvedAt: iso(p.approvedAt) } : {}),
        // only a name the customer typed herself is shown; staff names never reach her page
        ...(p.approvedAt != null && p.approvedByName ? { approvedByName: p.approvedByName } : {}),
        ...(p.changesRequestedAt != null ? { changesRequestedAt: iso(p.changesRequestedAt), changesComment: p.changesComment ?? '' } : {}),
        latest: i === proofs.length - 1,
      })),
    });
  },

  checkout(deps: AppDeps, token: string): Promise<CheckoutAnswer> {
    const { order } = resolveLink(deps, token);
    return paymentsService.createCheckout(deps, ordersRepository.byId(deps.db, order.id)!, statusUrl(deps, token));
  },

  approve(deps: AppDeps, token: string, revision: number, name: string): PublicOrder {
    const { order } = resolveLink(deps, token);
    const now = deps.now();
    deps.db.transaction((tx) => approveProofIn(tx, now, { orderId: order.id, revision, approvedAt: now, userId: null, customerName: name, note: null }));
    notifyFloorChanged(deps);
    return portalService.order(deps, token);
  },

  /** The customer sends the proof back: recorded, the planners mailed, the gate stays shut. */
  requestChanges(deps: AppDeps, token: string, revision: number, comment: string): PublicOrder {
    const { order } = resolveLink(deps, token);
    const now = deps.now();
    const factory = shippingRepository.factory(deps.db);
    const planners = shippingRepository.activeUsersWithRoles(deps.db, ['planner']);
    deps.db.transaction((tx) => {
      const { order: row } = requestProofChangesIn(tx, now, { orderId: order.id, revision, comment });
      const m = proofChangesMail({
        factory: factory.name,
        orderNumber: row.number,
        title: row.title,
        customer: order.customer,
        revision,
        comment,
        orderUrl: `${deps.env.publicUrl.replace(/\/$/, '')}/orders/${row.id}`,
      });
      for (const p of planners)
        enqueueMail(tx, now, { kind: 'proof_changes', to: p.email, ...m, orderId: row.id, dedupeKey: `proof-changes:${row.id}:${revision}:${now}:${p.id}` });
    });
    kickMail(deps);
    notifyFloorChanged(deps);
    return portalService.order(deps, token);
  },

  proofFile(deps: AppDeps, token: string, revision: number, thumbnail: boolean): { content: Buffer; mime: string; name: string } {
    const { order } = resolveLink(deps, token);
    const proof = ordersRepository.proof(deps.db, order.id, revision);
    if (!proof) throw notFound(`Proof revision ${revision}`);
    const content = thumbnail ? readThumbnail(deps.env.dataDir, proof.fileHash) : readFile(deps.env.dataDir, proof.fileHash);
    if (!content) throw notFound('The proof file');
    const ext = proof.mime === 'application/pdf' ? 'pdf' : proof.mime === 'image/png' ? 'png' : 'jpg';
    return { content, mime: thumbnail ? 'image/png' : proof.mime, name: `proof-${order.number}-rev${revision}.${thumbnail ? 'png' : ext}` };
  },

  photo(deps: AppDeps, token: string, photoId: string): { content: Buffer; mime: string } {
    const { order } = resolveLink(deps, token);
    const photo = portalRepository.sharedPhoto(deps.db, order.id, photoId);
    // a photo of another order, or one not marked shareable, does not exist for this link
    if (!photo) throw notFound('That photo');
    const content = readFile(deps.env.dataDir, photo.fileHash);
    if (!content) throw new AppError(404, 'not_found', 'That photo was not found.');
    return { content, mime: photo.mime };
  },
};
