// Read-only customer status links. The token is 256 random bits in base64url; only its SHA-256
// is stored, so a copy of the database cannot be turned into working links. Anyone holding a
// live token sees one order's title, customer, stage, projected date and tracking: nothing else.
import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import { calendarService } from './calendar.service';
import type { DbLike } from '../db/client';
import { shareLinksRepository, type QuoteLinkRow } from '../repositories/share-links.repository';
import { shippingRepository } from '../repositories/shipping.repository';
import { auditRepository } from '../repositories/audit.repository';
import { AppError, notFound } from '../errors';
import { loadProgress } from './order-progress.service';
import { measuredShipDates } from './ship-date.service';
import { CUSTOMER_STAGE_NAMES } from '@shared/domain/stages';
import { productionStory, type StepTimes } from '@shared/domain/production-story';
import type { Process, StationKind } from '@shared/domain/vocabulary';
import { ordersRepository } from '../repositories/orders.repository';
import { portalRepository } from '../repositories/portal.repository';
import type { ShareLinkRow } from '../repositories/share-links.repository';
import type { ShippingOrder } from '../repositories/shipping.repository';
import { publicStatusSchema, statusTokenSchema, type PublicStatus, type ShareLink, type ShareLinkInfo } from '@shared/schemas/shipping';
import { carrierTrackingUrl } from '@shared/domain/carrier-tracking';
import { localDate, iso } from '@shared/domain/time-zone';
import { defaultFrom } from './mail.service';

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

/** Makes a link inside the caller's transaction (the shipped mail makes one too). */
export function createLinkIn(
  tx: DbLike,
  deps: AppDeps,
  orderId: string,
  userId: string | null,
  purpose: 'manual' | 'shipped_mail' | 'quote_accepted',
  options: { validDays?: number } = {},
): ShareLink {
  const token = newToken();
  const now = deps.now();
  const id = crypto.randomUUID();
  const expiresAt = options.validDays ? now + options.validDays * 86_400_000 : null;
  shareLinksRepository.insert(tx, { id, orderId, tokenHash: hashToken(token), purpose, createdBy: userId, createdAt: now, expiresAt });
  auditRepository.record(tx, now, { userId, action: 'share_link.create', entity: 'order', entityId: orderId, detail: { linkId: id, purpose } });
  return { token, url: statusUrl(deps, token) };
}

const notFoundLink = () => new AppError(404, 'not_found', 'This status link does not exist or has been withdrawn.');

/** A token's live link and its order: 404 when unknown or withdrawn, 410 when past its end date. */
export function resolveLink(deps: AppDeps, token: string): { link: ShareLinkRow; order: ShippingOrder } {
  if (!statusTokenSchema.safeParse(token).success) throw notFoundLink();
  const link = shareLinksRepository.activeByHash(deps.db, hashToken(token));
  if (!link) throw notFoundLink();
  if (link.expiresAt != null && link.expiresAt <= deps.now()) {
    // the day it ended on the factory's clock, as every date the customer is told
    const endedOn = localDate(shippingRepository.factory(deps.db).timeZone, link.expiresAt);
    throw new AppError(410, 'link_expired', `This order link ended on ${endedOn}. Ask your contact at the factory for a new one.`);
  }
  const order = shippingRepository.order(deps.db, link.orderId);
  if (!order) throw notFoundLink();
  return { link, order };
}

/** The address of the factory's order mail ("orders@pins.example.com"), the customer's contact. */
function contactAddress(deps: AppDeps): string | null {
  const from = defaultFrom(deps);
  const m = /<([^<>\s]+@[^<>\s]+)>\s*$/.exec(from) ?? /^\s*([^<>\s]+@[^<>\s]+)\s*$/.exec(from);
  return m ? m[1] : null;
}

/** The public status of one order: its stages with dates, its story, the ship date and tracking. */
export function publicStatusOf(deps: AppDeps, token: string, link: ShareLinkRow, order: ShippingOrder): PublicStatus {
  const now = deps.now();
  const factory = shippingRepository.factory(deps.db);
  const p = loadProgress(deps.db, [order], now, factory.timeZone, {
    shipDates: measuredShipDates(deps, [order.id]),
    calendar: calendarService.calendar(deps),
  }).get(order.id)!;
  const last = p.shipments.at(-1);
  const row = ordersRepository.byId(deps.db, order.id)!;
  const done = new Set(p.stage.stages.filter((s) => s.done).map((s) => s.key));
  const story = productionStory({
    process: row.process as Process,
    releasedAt: row.releasedAt,
    shippedAt: p.shippedAt,
    done,
    steps: portalRepository.stepTimes(deps.db, order.id).filter((s) => s.stationKind) as StepTimes[],
    photos: portalRepository
      .sharedPhotos(deps.db, order.id)
      .map((ph) => ({ id: ph.id, stationKind: (ph.stationKind as StationKind | null) ?? null, takenAt: ph.createdAt })),
  });
  const doneAt = new Map(story.filter((s) => s.doneAt != null).map((s) => [s.stage, s.doneAt!]));
  const base = `/api/public/status/${encodeURIComponent(token)}`;
  const body: PublicStatus = {
    factory: factory.name,
    number: row.number,
    title: order.title,
    customer: order.customer,
    quantity: row.quantity,
    process: row.process,
    stage: p.stage.stage ? CUSTOMER_STAGE_NAMES[p.stage.stage] : 'Cancelled',
    stages: p.stage.stages.map((s) => ({ key: s.key, name: s.name, done: s.done, ...(s.done && doneAt.has(s.key) ? { at: iso(doneAt.get(s.key))! } : {}) })),
    projectedShipAt: p.status === 'shipped' || p.status === 'cancelled' ? null : iso(p.projection.expectedAt),
    updatedAt: iso(Math.max(row.updatedAt, ...story.map((s) => s.doneAt ?? s.startedAt)))!,
  };
  const contact = contactAddress(deps);
  if (contact) body.contact = contact;
  if (story.length) {
    body.story = story.map((s) => ({
      stage: s.stage,
      name: CUSTOMER_STAGE_NAMES[s.stage],
      at: iso(s.startedAt)!,
      ...(s.doneAt != null ? { doneAt: iso(s.doneAt)! } : {}),
      text: s.text,
      textZh: s.textZh,
      photos: s.photoIds.map((id) => `${base}/photos/${id}`),
    }));
  }
  if (p.shippedAt != null) body.shippedAt = iso(p.shippedAt)!;
  if (last) {
    body.carrier = last.carrier;
    body.trackingNumber = last.trackingNumber;
    const url = carrierTrackingUrl(last.carrier, last.trackingNumber, shareLinksRepository.carriers(deps.db));
    if (url) body.trackingUrl = url;
  }
  // Opening the page is recorded (sales sees that the customer looked), at most once a minute.
  if (link.lastOpenedAt == null || now - link.lastOpenedAt > 60_000) shareLinksRepository.touchOpened(deps.db, link.id, now);
  return publicStatusSchema.parse(body);
}

// ---------------------------------------------------------------------------------------
// Quote links: the same tokens (random, only their hash stored, revocable) opening one quote.

export function quoteUrl(deps: AppDeps, token: string): string {
  return `${deps.env.publicUrl.replace(/\/$/, '')}/quote/${token}`;
}

/** Makes a quote link inside the caller's transaction (sending a quote makes one). */
export function createQuoteLinkIn(tx: DbLike, deps: AppDeps, quoteId: string, userId: string | null): ShareLink {
  const token = newToken();
  const now = deps.now();
  const id = crypto.randomUUID();
  shareLinksRepository.insert(tx, { id, quoteId, tokenHash: hashToken(token), purpose: 'quote', createdBy: userId, createdAt: now });
  auditRepository.record(tx, now, { userId, action: 'share_link.create', entity: 'quote', entityId: quoteId, detail: { linkId: id, purpose: 'quote' } });
  return { token, url: quoteUrl(deps, token) };
}

const notFoundQuoteLink = () => new AppError(404, 'not_found', 'This quote link does not exist or has been withdrawn.');

/** The live quote link of a token, or 404 (malformed, unknown and withdrawn tokens look the same). */
export function quoteLinkOf(db: DbLike, token: string): QuoteLinkRow {
  if (!statusTokenSchema.safeParse(token).success) throw notFoundQuoteLink();
  const link = shareLinksRepository.activeQuoteLinkByHash(db, hashToken(token));
  if (!link) throw notFoundQuoteLink();
  return link;
}

/** Opening a quote is recorded (sales sees that the customer looked), at most once a minute. */
export function touchQuoteLink(deps: AppDeps, link: QuoteLinkRow): void {
  const now = deps.now();
  if (link.lastOpenedAt == null || now - link.lastOpenedAt > 60_000) shareLinksRepository.touchOpened(deps.db, link.id, now);
}

export function revokeQuoteLinksIn(tx: DbLike, deps: AppDeps, quoteId: string, userId: string): number {
  const now = deps.now();
  const n = shareLinksRepository.revokeAllForQuote(tx, quoteId, now, userId);
  auditRepository.record(tx, now, { userId, action: 'share_link.revoke', entity: 'quote', entityId: quoteId, detail: { revoked: n } });
  return n;
}

export const shareLinksService = {
  create(deps: AppDeps, orderId: string, userId: string, options: { validDays?: number } = {}): ShareLink {
    const order = shippingRepository.order(deps.db, orderId);
    if (!order) throw notFound('That order');
    if (order.status === 'cancelled') throw new AppError(409, 'order_cancelled', 'A cancelled order gets no status link.');
    return deps.db.transaction((tx) => createLinkIn(tx, deps, orderId, userId, 'manual', options));
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
    const { link, order } = resolveLink(deps, token);
    return publicStatusOf(deps, token, link, order);
  },
};
