// The local mail catcher: when no SMTP_URL is set, an SMTP server on a loopback port receives
// everything the app sends and keeps it in the data folder, where admins read it on the Outbox
// screen. Each message is kept as its raw .eml and a small .json summary parsed on arrival.
import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';
import type { CaughtMail } from '@shared/schemas/shipping';

export interface MailCatcher {
  host: string;
  port: number;
  dir: string;
  /** an SMTP URL nodemailer can send to */
  url: string;
  close(): Promise<void>;
}

/** Largest message the catcher accepts (proofs are attached). */
const MAX_BYTES = 25 * 1024 * 1024;

function addressText(a: AddressObject | AddressObject[] | undefined): string {
  if (!a) return '';
  return (Array.isArray(a) ? a : [a]).map((x) => x.text).join(', ');
}

export function mailDir(dataDir: string): string {
  return path.join(dataDir, 'mail');
}

/** Starts the catcher on 127.0.0.1 (port 0: any free port). */
export function startMailCatcher(options: { dataDir: string; port?: number; now?: () => number }): Promise<MailCatcher> {
  const dir = mailDir(options.dataDir);
  fs.mkdirSync(dir, { recursive: true });
  const now = options.now ?? Date.now;
  const server = new SMTPServer({
    // Loopback only, so no sign-in and no TLS; the app is the only sender.
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: MAX_BYTES,
    banner: 'Trayce local mail catcher',
    logger: false,
    onConnect(session, callback) {
      const ip = session.remoteAddress.replace(/^::ffff:/, '');
      if (ip !== '127.0.0.1' && ip !== '::1') return callback(new Error('Only local senders'));
      callback();
    },
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('error', callback);
      stream.on('end', () => {
        if ((stream as unknown as { sizeExceeded?: boolean }).sizeExceeded) {
          callback(Object.assign(new Error('Message too large'), { responseCode: 552 }));
          return;
        }
        const raw = Buffer.concat(chunks);
        const at = now();
        // Time first so a plain name sort is newest-last; the random part keeps names unique.
        const base = `${String(at).padStart(15, '0')}-${crypto.randomUUID()}`;
        simpleParser(raw)
          .then((parsed) => {
            const summary: CaughtMail = {
              id: base,
              to: addressText(parsed.to),
              from: addressText(parsed.from),
              subject: parsed.subject ?? '',
              text: parsed.text ?? '',
              html: typeof parsed.html === 'string' ? parsed.html : undefined,
              sentAt: new Date(at).toISOString(),
              attachments: parsed.attachments.map((a) => ({ filename: a.filename ?? 'attachment', contentType: a.contentType, size: a.size })),
            };
            fs.writeFileSync(path.join(dir, `${base}.eml`), raw);
            // Written last and renamed into place: a reader never sees half a summary.
            const tmp = path.join(dir, `${base}.json.tmp`);
            fs.writeFileSync(tmp, JSON.stringify(summary));
            fs.renameSync(tmp, path.join(dir, `${base}.json`));
            callback();
          })
          .catch((err: Error) => callback(err));
      });
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, '127.0.0.1', () => {
      server.off('error', reject);
      const port = (server.server.address() as AddressInfo).port;
      resolve({
        host: '127.0.0.1',
        port,
        dir,
        url: `smtp://127.0.0.1:${port}`,
        close: () => new Promise<void>((r) => server.close(() => r())),
      });
    });
  });
}

/** The caught messages, newest first. */
export function listCaughtMail(dataDir: string, limit = 200): CaughtMail[] {
  const dir = mailDir(dataDir);
  if (!fs.existsSync(dir)) return [];
  const names = fs
    .readdirSync(dir)
    .filter((n) => n.endsWith('.json'))
    .sort()
    .reverse()
    .slice(0, limit);
  const out: CaughtMail[] = [];
  for (const n of names) {
    try {
      out.push(JSON.parse(fs.readFileSync(path.join(dir, n), 'utf8')) as CaughtMail);
    } catch {
      // a summary that cannot be read is skipped; its .eml stays for inspection
    }
  }
  return out;
}

/** The raw message of a caught mail, by its id. */
export function readCaughtMail(dataDir: string, id: string): Buffer | null {
  if (!/^\d{15}-[0-9a-f-]{36}$/.test(id)) return null;
  const file = path.join(mailDir(dataDir), `${id}.eml`);
  return fs.existsSync(file) ? fs.readFileSync(file) : null;
}
