// Read-only customer status links. The token is 256 random bits in base64url; only its SHA-256
// is stored, so a copy of the database cannot be turned into working links. Anyone holding a
// live token sees one order's title, customer, stage, projected date and tracking: nothing else.
import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import type { DbLike } from '../db/client';
import { shareLinksRepository } from '../repositories/share-links.repository';
import { shippingRepository } from '../repositories/shipping.repository';
import { auditRepository } from '../repositories/audit.repository';
import { AppError, notFound } from '../errors';
import { loadProgress } from './order-progress.service';
import { measuredShipDates } from './ship-date.service';
import { CUSTOMER_STAGE_NAMES } from '@shared/domain/stages';
import { publicStatusSchema, statusTokenSchema, type PublicStatus, type ShareLink, type ShareLinkInfo } from '@shared/schemas/shipping';

/** Random bytes in a token: 256 bits, well over the 128 the product asks for. */
export const TOKEN_BYTES = 32;

export function newToken(): string {
  return crypto.randomBytes(TOKEN_BYTES).toString('base64url');
}

export function hashToken(token: string): string {
  return crypto.createHash('sha256').update(token, 'utf8').digest('hex');
}

export function statusUrl(deps: AppDeps, token: string): string {
  return `${deps.env.publicUrl.replace(/\/$/, '')}/status/${token}`;
}

const iso = (ms: number | null | undefined) => (ms == null ? null : new Date(ms).toISOString());

/** Makes a link inside the caller's transaction (the shipped mail makes one too). */
export function createLinkIn(tx: DbLike, deps: AppDeps, orderId: string, userId: string | null, purpose: 'manual' | 'shipped_mail'): ShareLink {
  const token = newToken();
  const now = deps.now();
  const id = crypto.randomUUID();
  shareLinksRepository.insert(tx, { id, orderId, tokenHash: hashToken(token), purpose, createdBy: userId, createdAt: now });
  auditRepository.record(tx, now, { userId, action: 'share_link.create', entity: 'order', entityId: orderId, detail: { linkId: id, purpose } });
  return { token, url: statusUrl(deps, token) };
}

const notFoundLink = () => new AppError(404, 'not_found', 'This status link does not exist or has been withdrawn.');

export const shareLinksService = {
  create(deps: AppDeps, orderId: string, userId: string): ShareLink {
    const order = shippingRepository.order(deps.db, orderId);
    if (!order) throw notFound('That order');
    if (order.status === 'cancelled') throw new AppError(409, 'order_cancelled', 'A cancelled order gets no status link.');
    return deps.db.transaction((tx) => createLinkIn(tx, deps, orderId, userId, 'manual'));
  },

  /** Withdraws every live link of the order (the one sent with a shipped mail too). */
  revoke(deps: AppDeps, orderId: string, userId: string): void {
    const order = shippingRepository.order(deps.db, orderId);
    if (!order) throw notFound('That order');
    const now = deps.now();
    deps.db.transaction((tx) => {
      const n = shareLinksRepository.revokeAll(tx, orderId, now, userId);
      auditRepository.record(tx, now, { userId, action: 'share_link.revoke', entity: 'order', entityId: orderId, detail: { revoked: n } });
    });
  },

  list(deps: AppDeps, orderId: string): ShareLinkInfo[] {
    return shareLinksRepository.forOrder(deps.db, orderId).map(({ link, by }) => ({
      id: link.id,
      purpose: link.purpose,
      createdAt: iso(link.createdAt)!,
      createdBy: by ?? null,
      revokedAt: iso(link.revokedAt),
      lastOpenedAt: iso(link.lastOpenedAt),
    }));
  },

  /** The public page's data: exactly the documented fields, checked against the strict schema. */
  publicStatus(deps: AppDeps, token: string): PublicStatus {
    if (!statusTokenSchema.safeParse(token).success) throw notFoundLink();
    const link = shareLinksRepository.activeByHash(deps.db, hashToken(token));
    if (!link) throw notFoundLink();
    const order = shippingRepository.order(deps.db, link.orderId);
    if (!order) throw notFoundLink();
    const now = deps.now();
    const p = loadProgress(deps.db, [order], now, shippingRepository.factory(deps.db).timeZone, { shipDates: measuredShipDates(deps, [order.id]) }).get(order.id)!;
    const last = p.shipments.at(-1);
    const body: PublicStatus = {
      title: order.title,
      customer: order.customer,
      stage: p.stage.stage ? CUSTOMER_STAGE_NAMES[p.stage.stage] : 'Cancelled',
      stages: p.stage.stages.map((s) => ({ name: s.name, done: s.done })),
      projectedShipAt: p.status === 'shipped' || p.status === 'cancelled' ? null : iso(p.projection.expectedAt),
    };
    if (p.shippedAt != null) body.shippedAt = iso(p.shippedAt)!;
    if (last) {
      body.carrier = last.carrier;
      body.trackingNumber = last.trackingNumber;
    }
    // Opening the page is recorded (sales sees that the customer looked), at most once a minute.
    if (link.lastOpenedAt == null || now - link.lastOpenedAt > 60_000) shareLinksRepository.touchOpened(deps.db, link.id, now);
    return publicStatusSchema.parse(body);
  },
};
