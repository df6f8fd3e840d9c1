// Outgoing mail through a queue: a message is a row written in the same transaction as the
// change it reports (a shipment, a proof), and a worker sends it afterwards, retrying with
// growing pauses. A send can therefore never block or fail a scan, a release or a shipment.
import crypto from 'node:crypto';
import nodemailer from 'nodemailer';
import type { SendMailOptions } from 'nodemailer';
import type { AppDeps } from '../app-deps';
import { calendarService } from './calendar.service';
import type { DbLike } from '../db/client';
import { mailRepository, type MailRow } from '../repositories/mail.repository';
import { shippingRepository } from '../repositories/shipping.repository';
import { auditRepository } from '../repositories/audit.repository';
import { listCaughtMail, startMailCatcher, type MailCatcher } from '../lib/mail-catcher';
import { readFile } from '../lib/file-store';
import { lateDigestMail, proofReadyMail, type DigestOrder } from '../lib/mail-templates';
import { AppError, notFound } from '../errors';
import { loadProgress } from './order-progress.service';
import { measuredShipDates } from './ship-date.service';
import { localDate, startOfLocalDate, iso } from '@shared/domain/time-zone';
import type { CaughtMail, MailQueueItem } from '@shared/schemas/shipping';

/** Pauses before each retry: 30 s, 2 min, 10 min, 30 min, 1 h, 2 h, 4 h; then the message is marked failed. */
export const RETRY_PAUSES_MS = [30_000, 120_000, 600_000, 1_800_000, 3_600_000, 7_200_000, 14_400_000];
export const MAX_ATTEMPTS = RETRY_PAUSES_MS.length + 1;
/** The late-risk digest goes out once a day from this local time (minutes after midnight). */
export const DIGEST_LOCAL_MINUTE = 7 * 60;

export interface QueuedAttachment {
  filename: string;
  contentType: string;
  /** content hash in the file store */
  fileHash: string;
}

export interface NewMail {
  kind: 'order_shipped' | 'late_digest' | 'proof_ready' | 'proof_changes' | 'quote_sent';
  to: string;
  subject: string;
  text: string;
  html: string;
  orderId?: string | null;
  dedupeKey?: string | null;
  attachments?: QueuedAttachment[];
}

/** Queues a message inside the caller's transaction. Returns false when the dedupe key was used already. */
export function enqueueMail(tx: DbLike, now: number, mail: NewMail): boolean {
  return mailRepository.insert(tx, {
    id: crypto.randomUUID(),
    kind: mail.kind,
    dedupeKey: mail.dedupeKey ?? null,
    orderId: mail.orderId ?? null,
    to: mail.to,
    subject: mail.subject,
    text: mail.text,
    html: mail.html,
    attachments: mail.attachments?.length ? mail.attachments : null,
    status: 'queued',
    attempts: 0,
    nextAttemptAt: now,
    createdAt: now,
  });
}

export function defaultFrom(deps: AppDeps): string {
  if (deps.env.mailFrom) return deps.env.mailFrom;
  const factory = shippingRepository.factory(deps.db).name.replace(/["\\]/g, '');
  let host = 'trayce.local';
  try {
    const h = new URL(deps.env.publicUrl).hostname;
    if (h.includes('.') && !/^\d+\.\d+\.\d+\.\d+$/.test(h)) host = h;
  } catch {
    /* keep the default */
  }
  return `"${factory}" <orders@${host}>`;
}

function toMessage(deps: AppDeps, row: MailRow): SendMailOptions {
  const attachments = ((row.attachments as QueuedAttachment[] | null) ?? []).map((a) => {
    const content = readFile(deps.env.dataDir, a.fileHash);
    if (!content) throw new Error(`attachment ${a.filename} is missing from the file store`);
    return { filename: a.filename, contentType: a.contentType, content };
  });
  return {
    from: deps.mail!.from,
    to: row.to,
    subject: row.subject,
    text: row.text,
    html: row.html ?? undefined,
    attachments,
    headers: { 'X-Trayce-Message': row.kind },
  };
}

/** Sends what is due; each failure is recorded and retried later. Never throws. */
export async function processMailQueue(deps: AppDeps, limit = 20): Promise<{ sent: number; retried: number; failed: number }> {
  const counts = { sent: 0, retried: 0, failed: 0 };
  if (!deps.mail) return counts;
  const due = mailRepository.due(deps.db, deps.now(), limit);
  for (const row of due) {
    const attempts = row.attempts + 1;
    try {
      await deps.mail.send(toMessage(deps, row));
      mailRepository.markSent(deps.db, row.id, deps.now(), attempts);
      counts.sent++;
    } catch (err) {
      const message = (err as Error).message?.slice(0, 500) || 'send failed';
      if (attempts >= MAX_ATTEMPTS) {
        mailRepository.markFailed(deps.db, row.id, attempts, message);
        counts.failed++;
        deps.log.error({ mailId: row.id, attempts, err: message }, 'mail given up');
      } else {
        mailRepository.markRetry(deps.db, row.id, attempts, deps.now() + RETRY_PAUSES_MS[attempts - 1], message);
        counts.retried++;
        deps.log.warn({ mailId: row.id, attempts, err: message }, 'mail send failed; will retry');
      }
    }
  }
  return counts;
}

/** Orders projected to ship after their due date, most overdue first. */
export function lateRiskOrders(deps: AppDeps): DigestOrder[] {
  const { timeZone } = shippingRepository.factory(deps.db);
  const open = shippingRepository.openOrders(deps.db);
  const progress = loadProgress(deps.db, open, deps.now(), timeZone, {
    shipDates: measuredShipDates(
      deps,
      open.map((o) => o.id),
    ),
    calendar: calendarService.calendar(deps),
  });
  const out: DigestOrder[] = [];
  for (const o of open) {
    const p = progress.get(o.id)!;
    if (!p.late || p.status === 'shipped') continue;
    out.push({
      number: o.number,
      customer: o.customer,
      title: o.title,
      dueDate: o.dueDate,
      projectedAt: p.projection.expectedAt,
      stage: p.stageText.split(':')[0],
    });
  }
  return out.sort((a, b) => a.dueDate.localeCompare(b.dueDate) || a.number.localeCompare(b.number));
}

/** Queues the day's late-risk digest to every active planner and sales person (once per day and person). */
export function queueLateDigest(deps: AppDeps, date?: string): { date: string; orders: number; queued: number } {
  const factory = shippingRepository.factory(deps.db);
  const day = date ?? localDate(factory.timeZone, deps.now());
  const orders = lateRiskOrders(deps);
  if (orders.length === 0) return { date: day, orders: 0, queued: 0 };
  const people = shippingRepository.activeUsersWithRoles(deps.db, ['planner', 'sales']);
  const now = deps.now();
  let queued = 0;
  deps.db.transaction((tx) => {
    for (const person of people) {
      const m = lateDigestMail({
        factory: factory.name,
        timeZone: factory.timeZone,
        date: day,
        name: person.name,
        orders,
        appUrl: deps.env.publicUrl.replace(/\/$/, ''),
      });
      if (enqueueMail(tx, now, { kind: 'late_digest', to: person.email, ...m, dedupeKey: `late-digest:${day}:${person.id}` })) queued++;
    }
  });
  if (queued > 0) kickMail(deps);
  return { date: day, orders: orders.length, queued };
}

function proofExtension(mime: string): string {
  return mime === 'application/pdf' ? 'pdf' : mime === 'image/png' ? 'png' : mime === 'image/jpeg' ? 'jpg' : 'bin';
}

/** Queues "proof ready for approval" to the customer contact, with the proof attached. */
export function queueProofReady(deps: AppDeps, orderId: string, revision: number, userId: string | null): { to: string } {
  const order = shippingRepository.order(deps.db, orderId);
  if (!order) throw notFound('That order');
  const proof = shippingRepository.proof(deps.db, orderId, revision);
  if (!proof) throw notFound(`Proof revision ${revision}`);
  if (!order.contactEmail)
    throw new AppError(409, 'no_contact_email', `${order.customer} has no contact e-mail address yet. Add one on the order status page first.`);
  if (!readFile(deps.env.dataDir, proof.fileHash)) throw new AppError(409, 'proof_file_missing', 'The proof file is missing from the file store.');
  const factory = shippingRepository.factory(deps.db);
  const filename = `proof-${order.number}-rev${revision}.${proofExtension(proof.mime)}`;
  const m = proofReadyMail({ factory: factory.name, orderNumber: order.number, title: order.title, revision, contactName: order.contactName, filename });
  const now = deps.now();
  deps.db.transaction((tx) => {
    enqueueMail(tx, now, {
      kind: 'proof_ready',
      to: order.contactEmail!,
      ...m,
      orderId,
      attachments: [{ filename, contentType: proof.mime, fileHash: proof.fileHash }],
    });
    auditRepository.record(tx, now, { userId, action: 'mail.proof_ready', entity: 'order', entityId: orderId, detail: { revision, to: order.contactEmail } });
  });
  kickMail(deps);
  return { to: order.contactEmail };
}

// ---- the worker ------------------------------------------------------------------------------

interface Worker {
  timer: NodeJS.Timeout;
  running: boolean;
  lastDigestDate: string | null;
  tick: () => Promise<void>;
}
const workers = new WeakMap<object, Worker>();

/** Runs the queue soon (after a message was queued), when a worker is running. */
export function kickMail(deps: AppDeps): void {
  const w = workers.get(deps.db);
  if (w) setImmediate(() => void w.tick());
}

function digestDue(deps: AppDeps, w: Worker): string | null {
  const { timeZone } = shippingRepository.factory(deps.db);
  const now = deps.now();
  const date = localDate(timeZone, now);
  if (w.lastDigestDate === date) return null;
  if (now - startOfLocalDate(timeZone, date) < DIGEST_LOCAL_MINUTE * 60_000) return null;
  return date;
}

export function startMailWorker(deps: AppDeps, intervalMs = 5000): { stop(): void } {
  const w: Worker = {
    running: false,
    lastDigestDate: null,
    timer: undefined as unknown as NodeJS.Timeout,
    tick: async () => {
      if (w.running) return;
      w.running = true;
      try {
        const date = digestDue(deps, w);
        if (date) {
          queueLateDigest(deps, date);
          w.lastDigestDate = date;
        }
        await processMailQueue(deps);
      } catch (err) {
        deps.log.error({ err: (err as Error).message }, 'mail worker tick failed');
      } finally {
        w.running = false;
      }
    },
  };
  w.timer = setInterval(() => void w.tick(), intervalMs);
  w.timer.unref();
  workers.set(deps.db, w);
  setImmediate(() => void w.tick());
  return {
    stop() {
      clearInterval(w.timer);
      workers.delete(deps.db);
    },
  };
}

/**
 * Connects outgoing mail: to SMTP_URL when set, otherwise to the local catcher started here on
 * a loopback port. Returns the sender for AppDeps.mail; createApp starts the queue worker.
 */
export async function connectMail(deps: AppDeps): Promise<{ mail: NonNullable<AppDeps['mail']>; catcher: MailCatcher | null; close(): Promise<void> }> {
  const catcher = deps.env.smtpUrl ? null : await startMailCatcher({ dataDir: deps.env.dataDir });
  const transport = deps.env.smtpUrl
    ? nodemailer.createTransport(deps.env.smtpUrl)
    : nodemailer.createTransport({ host: catcher!.host, port: catcher!.port, secure: false, ignoreTLS: true });
  if (catcher) deps.log.info(`Mail goes to the local catcher on ${catcher.url}; admins read it on the Outbox screen.`);
  return {
    mail: { send: (m) => transport.sendMail(m), from: defaultFrom(deps) },
    catcher,
    async close() {
      transport.close();
      await catcher?.close();
    },
  };
}

/** For tests that add mail to a test app already made: connects it and runs the queue worker. */
export async function startMail(deps: AppDeps, options: { intervalMs?: number } = {}): Promise<{ catcher: MailCatcher | null; stop(): Promise<void> }> {
  const connected = await connectMail(deps);
  deps.mail = connected.mail;
  const worker = startMailWorker(deps, options.intervalMs);
  return {
    catcher: connected.catcher,
    async stop() {
      worker.stop();
      await connected.close();
    },
  };
}

export const mailService = {
  caught: (deps: AppDeps, limit: number): CaughtMail[] => listCaughtMail(deps.env.dataDir, limit),
  queue: (deps: AppDeps, limit: number): MailQueueItem[] =>
    mailRepository.recent(deps.db, limit).map((r) => ({
      id: r.id,
      kind: r.kind,
      to: r.to,
      subject: r.subject,
      status: r.status,
      attempts: r.attempts,
      nextAttemptAt: iso(r.nextAttemptAt)!,
      lastError: r.lastError,
      createdAt: iso(r.createdAt)!,
      sentAt: iso(r.sentAt),
    })),
  retry(deps: AppDeps, id: string, userId: string) {
    if (!mailRepository.requeue(deps.db, id, deps.now())) throw new AppError(409, 'not_failed', 'Only a message that failed can be sent again.');
    auditRepository.record(deps.db, deps.now(), { userId, action: 'mail.retry', entity: 'mail', entityId: id });
    kickMail(deps);
  },
};
