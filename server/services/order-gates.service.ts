// The two gates before release: the payment (or a manager's exception) and the customer's
// approval of the artwork proof, with the proof files themselves. The rules the gates follow are
// in order-gates.ts (shared with online payment and the customer's page).
import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import { ordersRepository } from '../repositories/orders.repository';
import { badInput, conflict, forbidden, notFound } from '../errors';
import { putFile, putThumbnail, readFile } from '../lib/file-store';
import { checkUploadName } from '../lib/uploads';
import { decodeUpload, type DecodedUpload } from '../lib/upload-decode';
import type { PaymentBody, ProofApprovalBody } from '@shared/schemas/orders';
import type { Role } from '@shared/domain/vocabulary';
import { approveProofIn, recordPaymentIn, refreshStatus } from './order-gates';
import { auditOrder, getOrder, ordersService, today } from './orders.service';
import { shipDateService } from './ship-date.service';

/** Roles that may record a payment exception (release without payment). */
export const EXCEPTION_ROLES: readonly Role[] = ['manager', 'admin'];

export const orderGatesService = {
  recordPayment(deps: AppDeps, id: string, body: PaymentBody, actor: { id: string; role: Role }) {
    const { db } = deps;
    const now = deps.now();
    if ('exception' in body && !EXCEPTION_ROLES.includes(actor.role)) {
      throw forbidden('Only a manager can let an order start without payment.');
    }
    db.transaction((tx) => {
      const order = getOrder(tx, id);
      if (order.status === 'cancelled') throw conflict('order_cancelled', `Order ${order.number} is cancelled.`);
      const paymentId = crypto.randomUUID();
      if ('exception' in body) {
        ordersRepository.insertPayment(tx, {
          id: paymentId,
          orderId: id,
          amount: null,
          reference: 'exception',
          isException: true,
          note: body.reason,
          recordedBy: actor.id,
          recordedAt: now,
        });
        auditOrder(tx, now, actor.id, 'order.payment_exception', id, `Release without payment allowed: ${body.reason}`, { params: { reason: body.reason } });
      } else {
        const note = body.paidOn ? `paid on ${body.paidOn}` : '';
        recordPaymentIn(tx, now, {
          orderId: id,
          amount: body.amount,
          currency: body.currency,
          reference: body.reference,
          source: 'manual',
          recordedBy: actor.id,
          note,
        });
        return;
      }
      refreshStatus(tx, order, now);
    });
    return ordersService.get(deps, id);
  },

  async uploadProof(deps: AppDeps, id: string, file: Express.Multer.File | undefined, actorId: string): Promise<{ revision: number }> {
    const { db } = deps;
    const order = getOrder(db, id);
    if (order.status === 'cancelled') throw conflict('order_cancelled', `Order ${order.number} is cancelled.`);
    if (!file) throw badInput('Choose a proof file to upload (field "file").', undefined, 'file_missing');
    const name = checkUploadName(file.originalname);
    if (file.size === 0 || file.buffer.length === 0) throw badInput('The file is empty.', undefined, 'empty_file');
    // decoded in full before anything is kept; the thumbnail is what travellers print
    const decoded = await decodeUpload(file.buffer, name, ['application/pdf', 'image/png', 'image/jpeg']);
    return orderGatesService.storeProof(deps, id, { buffer: file.buffer, name, decoded }, actorId);
  },

  /** Keeps a proof that decodeUpload has checked, with its thumbnail, as the next revision. */
  storeProof(deps: AppDeps, id: string, file: { buffer: Buffer; name: string; decoded: DecodedUpload }, actorId: string): { revision: number } {
    const { db } = deps;
    const order = getOrder(db, id);
    if (order.status === 'cancelled') throw conflict('order_cancelled', `Order ${order.number} is cancelled.`);
    const { name } = file;
    const { mime, thumbnail } = file.decoded;
    const now = deps.now();
    const { hash, sizeBytes } = putFile(deps.env.dataDir, file.buffer);
    if (thumbnail) putThumbnail(deps.env.dataDir, hash, thumbnail);
    return db.transaction((tx) => {
      const existing = ordersRepository.proofs(tx, id);
      const revision = (existing[existing.length - 1]?.revision ?? 0) + 1;
      ordersRepository.insertProof(tx, {
        id: crypto.randomUUID(),
        orderId: id,
        revision,
        fileHash: hash,
        mime,
        sizeBytes,
        originalName: name,
        uploadedBy: actorId,
        uploadedAt: now,
      });
      auditOrder(tx, now, actorId, 'order.proof_upload', id, `Proof revision ${revision} uploaded (${name})`, { params: { revision, file: name } });
      refreshStatus(tx, getOrder(tx, id), now);
      return { revision };
    });
  },

  proofFile(deps: AppDeps, id: string, revision: number) {
    const order = getOrder(deps.db, id);
    const proof = ordersRepository.proof(deps.db, id, revision);
    if (!proof) throw notFound(`Proof revision ${revision}`);
    const content = readFile(deps.env.dataDir, proof.fileHash);
    if (!content) throw notFound('The stored proof file');
    const ext = proof.mime === 'application/pdf' ? 'pdf' : proof.mime === 'image/png' ? 'png' : 'jpg';
    return { content, mime: proof.mime, downloadName: `proof-${order.number}-rev${revision}.${ext}` };
  },

  approveProof(deps: AppDeps, id: string, revision: number, body: ProofApprovalBody, actorId: string) {
    const now = deps.now();
    if (body.approvedOn && body.approvedOn > today(now, shipDateService.timeZone(deps))) {
      throw badInput('The approval date cannot be in the future.', [{ path: ['approvedOn'], message: 'In the future' }]);
    }
    const approvedAt = body.approvedOn ? Math.min(Date.parse(`${body.approvedOn}T12:00:00Z`), now) : now;
    deps.db.transaction((tx) => approveProofIn(tx, now, { orderId: id, revision, approvedAt, userId: actorId, customerName: null, note: body.note ?? null }));
    return ordersService.get(deps, id);
  },
};
