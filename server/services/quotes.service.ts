// Quotes: a spec priced from the routing it would get, at up to six quantities; a change is a new
// version (the old one kept); sent to the customer with a link; accepted by the customer through
// that link, which makes the order from the quote's spec.
import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import type { DbLike } from '../db/client';
import { quotesRepository, type QuoteRow, type QuoteVersionRow } from '../repositories/quotes.repository';
import { ordersRepository } from '../repositories/orders.repository';
import { mouldsRepository } from '../repositories/moulds.repository';
import { shippingRepository } from '../repositories/shipping.repository';
import { shareLinksRepository } from '../repositories/share-links.repository';
import { auditRepository } from '../repositories/audit.repository';
import { badInput, conflict, notFound } from '../errors';
import { customerFor, ordersService } from './orders.service';
import { routingFromSpec } from './order-spec.service';
import { calendarService } from './calendar.service';
import { projectQuantities } from './what-if.service';
import { createLinkIn, createQuoteLinkIn, quoteLinkOf, revokeQuoteLinksIn, touchQuoteLink } from './share-links.service';
import { enqueueMail, kickMail } from './mail.service';
import { putFile } from '../lib/file-store';
import { quotePdf } from '../lib/quote-pdf';
import { quoteSentMail } from '../lib/mail-templates';
import { priceQuote, type QuotePricing } from '@shared/domain/costing';
import { requiredMoulds } from '@shared/domain/routing';
import { DAY, localDate, iso } from '@shared/domain/time-zone';
import {
  costingSettingsPatchSchema,
  costingSettingsSchema,
  DEFAULT_COSTING_SETTINGS,
  mergeCostingSettings,
  type CostingSettings,
  type CostingSettingsPatch,
} from '@shared/schemas/costing';
import {
  publicQuoteSchema,
  type AcceptQuoteBody,
  type AcceptQuoteResult,
  type PublicQuote,
  type QuoteBody,
  type QuoteLineView,
  type QuoteListItem,
  type QuoteShipDates,
  type QuoteSpec,
  type QuoteStatus,
  type QuoteView,
} from '@shared/schemas/quotes';

const FIRST_QUOTE_NUMBER = 2001;

export const SHIP_DATE_BASIS =
  "Simulated runs of the whole open floor with this order added, released now at each quantity: every open tray competes for the stations' places, with handover, hold and process times measured on the floor, on the working calendar. Expected is the average of the runs; the later date is met in 85 % of the runs.";

// ---------------------------------------------------------------------------------------
// Rates

export function costingSettings(db: DbLike): CostingSettings {
  const stored = costingSettingsPatchSchema.safeParse(quotesRepository.costingSettings(db) ?? {});
  const merged = mergeCostingSettings(DEFAULT_COSTING_SETTINGS, stored.success ? stored.data : null);
  const checked = costingSettingsSchema.safeParse(merged);
  return checked.success ? checked.data : DEFAULT_COSTING_SETTINGS;
}

// ---------------------------------------------------------------------------------------
// Pricing

function reuseOf(db: DbLike, spec: QuoteSpec): { front?: boolean; back?: boolean } {
  if (!spec.reorderOf) return {};
  const earlier = ordersRepository.byId(db, spec.reorderOf);
  if (!earlier) throw badInput('The order to repeat does not exist.', [{ path: ['spec', 'reorderOf'], message: 'Unknown order' }], 'unknown_order');
  const out: { front?: boolean; back?: boolean } = {};
  for (const side of requiredMoulds(spec)) out[side] = !!mouldsRepository.reusable(db, earlier.designKey, side);
  return out;
}

function price(db: DbLike, spec: QuoteSpec, quantities: number[], settings: CostingSettings): QuotePricing {
  return priceQuote({ spec, routing: routingFromSpec(db, spec), quantities, reuseMoulds: reuseOf(db, spec), settings });
}

// ---------------------------------------------------------------------------------------
// Ship dates per break: the open floor projected with the order added at each quantity, as the
// what-if projects it.

function shipDates(deps: AppDeps, spec: QuoteSpec, quantities: number[]): QuoteShipDates[] {
  try {
    return projectQuantities(deps, spec, quantities);
  } catch (err) {
    deps.log.warn({ err: (err as Error).message }, 'quote ship dates not projected');
    return quantities.map(() => ({ expectedAt: null, p85At: null }));
  }
}

// ---------------------------------------------------------------------------------------

function getQuote(db: DbLike, id: string): QuoteRow {
  const q = quotesRepository.byId(db, id);
  if (!q) throw notFound('That quote');
  return q;
}

function currentVersion(db: DbLike, q: QuoteRow): QuoteVersionRow {
  return quotesRepository.version(db, q.id, q.currentVersion)!;
}

function todayIn(deps: AppDeps): string {
  return localDate(calendarService.timeZone(deps), deps.now());
}

function statusOf(deps: AppDeps, q: QuoteRow, v: QuoteVersionRow): QuoteStatus {
  if (q.orderId) return 'accepted';
  if (v.validUntil < todayIn(deps)) return 'expired';
  return q.sentAt ? 'sent' : 'draft';
}

function checkValidUntil(deps: AppDeps, validUntil: string) {
  if (validUntil < todayIn(deps)) {
    throw badInput('The quote would already have expired.', [{ path: ['validUntil'], message: 'Pick today or a later day' }], 'bad_valid_until');
  }
}

function insertVersion(tx: DbLike, deps: AppDeps, quoteId: string, version: number, body: QuoteBody, userId: string) {
  const settings = costingSettings(tx);
  const pricing = price(tx, body.spec, body.quantities, settings);
  quotesRepository.insertVersion(tx, {
    id: crypto.randomUUID(),
    quoteId,
    version,
    spec: body.spec,
    quantities: body.quantities,
    validUntil: body.validUntil,
    notes: body.notes,
    currency: settings.currency,
    settings,
    pricing,
    createdBy: userId,
    createdAt: deps.now(),
  });
}

function view(deps: AppDeps, q: QuoteRow): QuoteView {
  const { db } = deps;
  const v = currentVersion(db, q);
  const pricing = v.pricing as QuotePricing;
  const customer = ordersRepository.customerById(db, q.customerId)!;
  const spec = v.spec as QuoteSpec;
  const dates = shipDates(deps, spec, v.quantities);
  const order = q.orderId ? ordersRepository.byId(db, q.orderId) : undefined;
  return {
    id: q.id,
    number: q.number,
    version: q.currentVersion,
    status: statusOf(deps, q, v),
    customer: { id: customer.id, name: customer.name },
    contactName: q.contactName,
    contactEmail: q.contactEmail,
    spec,
    quantities: v.quantities,
    validUntil: v.validUntil,
    notes: v.notes,
    currency: v.currency,
    materialGrams: pricing.materialGrams,
    platedDm2: pricing.platedDm2,
    moulds: pricing.moulds,
    mouldCharge: pricing.mouldCharge,
    lines: pricing.lines.map((l, i): QuoteLineView => ({ ...l, shipDates: dates[i] })),
    shipDateBasis: SHIP_DATE_BASIS,
    versions: quotesRepository
      .versions(db, q.id)
      .map(({ v: x, by }) => ({ version: x.version, createdAt: iso(x.createdAt)!, createdBy: by ?? null, quantities: x.quantities, validUntil: x.validUntil })),
    sentAt: iso(q.sentAt),
    accepted:
      q.orderId && order
        ? {
            orderId: q.orderId,
            orderNumber: order.number,
            quantity: q.acceptedQuantity!,
            version: q.acceptedVersion!,
            name: q.acceptedName ?? '',
            at: iso(q.acceptedAt)!,
          }
        : null,
    links: shareLinksRepository
      .forQuote(db, q.id)
      .map((l) => ({ id: l.id, createdAt: iso(l.createdAt)!, revokedAt: iso(l.revokedAt), lastOpenedAt: iso(l.lastOpenedAt) })),
    createdAt: iso(q.createdAt)!,
    updatedAt: iso(q.updatedAt)!,
  };
}

export const quotesService = {
  settings: (deps: AppDeps) => costingSettings(deps.db),

  saveSettings(deps: AppDeps, patch: CostingSettingsPatch, userId: string): CostingSettings {
    const merged = mergeCostingSettings(costingSettings(deps.db), patch);
    const checked = costingSettingsSchema.safeParse(merged);
    if (!checked.success)
      throw badInput(
        'Those rates do not fit together.',
        checked.error.issues.map((i) => ({ path: i.path as (string | number)[], message: i.message })),
      );
    const now = deps.now();
    deps.db.transaction((tx) => {
      quotesRepository.saveCostingSettings(tx, checked.data);
      auditRepository.record(tx, now, { userId, action: 'settings.costing', entity: 'settings', entityId: 'costing', detail: { keys: Object.keys(patch) } });
    });
    return checked.data;
  },

  list(deps: AppDeps): QuoteListItem[] {
    return quotesRepository.list(deps.db).map(({ quote, version, customer, orderNumber }) => {
      const pricing = version.pricing as QuotePricing;
      const spec = version.spec as QuoteSpec;
      return {
        id: quote.id,
        number: quote.number,
        version: quote.currentVersion,
        status: statusOf(deps, quote, version),
        customer,
        title: spec.title,
        process: spec.process,
        quantities: version.quantities,
        validUntil: version.validUntil,
        currency: version.currency,
        fromTotal: pricing.lines[0]?.total ?? null,
        orderNumber: orderNumber ?? null,
        updatedAt: iso(quote.updatedAt)!,
      };
    });
  },

  get: (deps: AppDeps, id: string): QuoteView => view(deps, getQuote(deps.db, id)),

  create(deps: AppDeps, body: QuoteBody, userId: string): QuoteView {
    checkValidUntil(deps, body.validUntil);
    const now = deps.now();
    const id = crypto.randomUUID();
    deps.db.transaction((tx) => {
      const customerId = customerFor(tx, body, now);
      const number = `Q-${Math.max(FIRST_QUOTE_NUMBER - 1, quotesRepository.maxNumber(tx) ?? 0) + 1}`;
      quotesRepository.insert(tx, {
        id,
        number,
        customerId,
        contactName: body.contactName || null,
        contactEmail: body.contactEmail,
        currentVersion: 1,
        createdBy: userId,
        createdAt: now,
        updatedAt: now,
      });
      insertVersion(tx, deps, id, 1, body, userId);
      auditRepository.record(tx, now, { userId, action: 'quote.create', entity: 'quote', entityId: id, detail: { number } });
    });
    return quotesService.get(deps, id);
  },

  /** A change makes a new version; the earlier versions stay as they were. */
  update(deps: AppDeps, id: string, body: QuoteBody, userId: string): QuoteView {
    checkValidUntil(deps, body.validUntil);
    const now = deps.now();
    deps.db.transaction((tx) => {
      const q = getQuote(tx, id);
      if (q.orderId) throw conflict('quote_accepted', `Quote ${q.number} is accepted; it can no longer change. Make a new quote.`);
      const version = q.currentVersion + 1;
      insertVersion(tx, deps, id, version, body, userId);
      quotesRepository.update(tx, id, {
        customerId: customerFor(tx, body, now),
        contactName: body.contactName || null,
        contactEmail: body.contactEmail,
        currentVersion: version,
        updatedAt: now,
      });
      auditRepository.record(tx, now, { userId, action: 'quote.version', entity: 'quote', entityId: id, detail: { version } });
    });
    return quotesService.get(deps, id);
  },

  pdf(deps: AppDeps, id: string): Promise<Buffer> {
    const v = view(deps, getQuote(deps.db, id));
    const factory = shippingRepository.factory(deps.db);
    return quotePdf({ factory: factory.name, timeZone: factory.timeZone, quote: v });
  },

  /** Sends the quote: a new customer link, and a mail with the link and the PDF to the contact. */
  async send(deps: AppDeps, id: string, userId: string): Promise<{ url: string; to: string }> {
    const q = getQuote(deps.db, id);
    const v = currentVersion(deps.db, q);
    if (q.orderId) throw conflict('quote_accepted', `Quote ${q.number} is already accepted.`);
    if (v.validUntil < todayIn(deps))
      throw conflict('quote_expired', `Quote ${q.number} expired on ${v.validUntil}. Make a new version with a later date first.`);
    const pdf = await quotesService.pdf(deps, id);
    const stored = putFile(deps.env.dataDir, pdf);
    const factory = shippingRepository.factory(deps.db);
    const spec = v.spec as QuoteSpec;
    const now = deps.now();
    const link = deps.db.transaction((tx) => {
      const l = createQuoteLinkIn(tx, deps, id, userId);
      const filename = `quote-${q.number}-v${q.currentVersion}.pdf`;
      const m = quoteSentMail({ factory: factory.name, number: q.number, title: spec.title, contactName: q.contactName, validUntil: v.validUntil, url: l.url });
      enqueueMail(tx, now, {
        kind: 'quote_sent',
        to: q.contactEmail,
        ...m,
        attachments: [{ filename, contentType: 'application/pdf', fileHash: stored.hash }],
      });
      quotesRepository.update(tx, id, { sentAt: now, updatedAt: now });
      auditRepository.record(tx, now, {
        userId,
        action: 'quote.send',
        entity: 'quote',
        entityId: id,
        detail: { to: q.contactEmail, version: q.currentVersion },
      });
      return l;
    });
    kickMail(deps);
    return { url: link.url, to: q.contactEmail };
  },

  /** Withdraws every live link of the quote. */
  revokeLinks(deps: AppDeps, id: string, userId: string): void {
    getQuote(deps.db, id);
    deps.db.transaction((tx) => revokeQuoteLinksIn(tx, deps, id, userId));
  },

  /** What the customer sees: prices per quantity, no costs. */
  publicView(deps: AppDeps, token: string): PublicQuote {
    const link = quoteLinkOf(deps.db, token);
    const q = getQuote(deps.db, link.quoteId);
    const v = view(deps, q);
    touchQuoteLink(deps, link);
    const s = v.spec;
    const order = q.orderId ? ordersRepository.byId(deps.db, q.orderId) : undefined;
    return publicQuoteSchema.parse({
      factory: shippingRepository.factory(deps.db).name,
      number: v.number,
      version: v.version,
      status: v.status,
      customer: v.customer.name,
      contactName: v.contactName,
      title: s.title,
      spec: {
        process: s.process,
        material: s.material,
        sizeMm: s.sizeMm,
        heightMm: s.heightMm,
        thicknessMm: s.thicknessMm,
        colours: s.colours,
        plating: s.plating,
        backing: s.backing,
        backLogo: s.backLogo,
        printing: s.printing,
        epoxy: s.epoxy,
        packaging: s.packaging,
        overrunPct: s.overrunPct,
      },
      currency: v.currency,
      lines: v.lines.map((l) => ({
        quantity: l.quantity,
        unitPrice: l.unitPrice,
        goodsTotal: l.goodsTotal,
        mouldCharge: l.mouldCharge,
        total: l.total,
        expectedShipAt: l.shipDates.expectedAt,
        p85ShipAt: l.shipDates.p85At,
      })),
      mouldCharge: v.mouldCharge,
      validUntil: v.validUntil,
      notes: v.notes,
      accepted: v.accepted && order ? { quantity: v.accepted.quantity, name: v.accepted.name, at: v.accepted.at, orderNumber: order.number } : null,
    });
  },

  /**
   * The customer accepts one quantity: the order is made from the quote's spec (awaiting
   * payment) with a status link for the customer. Refused, changing nothing, when the quote is
   * accepted already, expired, or the link withdrawn.
   */
  accept(deps: AppDeps, token: string, body: AcceptQuoteBody): AcceptQuoteResult {
    const now = deps.now();
    return deps.db.transaction((tx) => {
      const link = quoteLinkOf(tx, token);
      const q = getQuote(tx, link.quoteId);
      if (q.orderId)
        throw conflict(
          'quote_accepted',
          `Quote ${q.number} was already accepted${q.acceptedName ? ` by ${q.acceptedName}` : ''}. Use the order link you were given then.`,
        );
      const v = currentVersion(tx, q);
      if (v.validUntil < todayIn(deps)) throw conflict('quote_expired', `This quote was valid until ${v.validUntil}. Ask us for a new one.`);
      if (!v.quantities.includes(body.quantity)) {
        throw badInput(
          `Choose one of the quoted quantities: ${v.quantities.join(', ')}.`,
          [{ path: ['quantity'], message: 'Not a quoted quantity' }],
          'quantity_not_quoted',
        );
      }
      const spec = v.spec as QuoteSpec;
      const p85 = shipDates(deps, spec, [body.quantity])[0];
      const due = p85.p85At ? p85.p85At.slice(0, 10) : localDate(calendarService.timeZone(deps), now + 21 * DAY);
      // eslint-disable-next-line @typescript-eslint/no-unused-vars
      const { heightMm, thicknessMm, outlineFactor, ...orderSpec } = spec;
      const line = (v.pricing as QuotePricing).lines.find((l) => l.quantity === body.quantity)!;
      const orderId = ordersService.createInTx(
        deps,
        tx,
        { ...orderSpec, customerId: q.customerId, quantity: body.quantity, dueDate: due, priceTotal: line.total, currency: v.currency },
        null,
      );
      const order = ordersRepository.byId(tx, orderId)!;
      if (
        !quotesRepository.markAccepted(tx, q.id, {
          orderId,
          acceptedVersion: v.version,
          acceptedQuantity: body.quantity,
          acceptedName: body.name,
          acceptedAt: now,
          updatedAt: now,
        })
      ) {
        throw conflict('quote_accepted', `Quote ${q.number} was already accepted.`);
      }
      shippingRepository.setCustomerContact(tx, q.customerId, { contactEmail: q.contactEmail, ...(q.contactName ? { contactName: q.contactName } : {}) }, now);
      if (q.createdBy) shippingRepository.setSalesOwner(tx, orderId, q.createdBy, now);
      const status = createLinkIn(tx, deps, orderId, null, 'quote_accepted');
      auditRepository.record(tx, now, {
        userId: null,
        action: 'quote.accept',
        entity: 'quote',
        entityId: q.id,
        detail: {
          text: `Quote ${q.number} v${v.version} accepted by ${body.name} for ${body.quantity} pieces`,
          orderId,
          quantity: body.quantity,
          name: body.name,
        },
      });
      auditRepository.record(tx, now, {
        userId: null,
        action: 'order.from_quote',
        entity: 'order',
        entityId: orderId,
        detail: {
          text: `Made from quote ${q.number} v${v.version}, accepted by ${body.name}`,
          quoteId: q.id,
          params: { quote: q.number, version: v.version, name: body.name },
        },
      });
      return { orderId, number: order.number, statusToken: status.token };
    });
  },

  /** The accepted price of an order made from a quote (what the customer owes), or null. */
  acceptedPriceOfOrder(deps: AppDeps, orderId: string): { total: number; currency: string; quoteId: string } | null {
    const q = quotesRepository.byOrderId(deps.db, orderId);
    if (!q || q.acceptedVersion == null) return null;
    const v = quotesRepository.version(deps.db, q.id, q.acceptedVersion)!;
    const line = (v.pricing as QuotePricing).lines.find((l) => l.quantity === q.acceptedQuantity);
    return line ? { total: line.total, currency: v.currency, quoteId: q.id } : null;
  },
};
