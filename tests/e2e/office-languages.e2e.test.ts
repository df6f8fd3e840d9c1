// The office screens in each person's language, in Chromium at 1440 x 900: every role signs in,
// switches to Chinese, and the screens translated so far carry no English words of ours (what
// customers and people wrote, numbers, order and tray numbers, units and the trade's
// abbreviations may stay); a screenshot of each role's first screen in both languages is kept.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser, screenshot, DESKTOP } from '../support/browser';
import { DEMO_PASSWORD } from '../../server/seed/demo-people';
import { paths, roleHome } from '../../src/config/paths';
import type { Locale, Role } from '@shared/domain/vocabulary';

const base = () => process.env.TRAYCE_E2E_URL!;
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => browser?.close());

type OfficeRole = Exclude<Role, 'operator'>;
const ROLES: OfficeRole[] = ['planner', 'supervisor', 'manager', 'sales', 'admin'];

/** The screens already put through the translations, per role. */
const TRANSLATED: Partial<Record<OfficeRole, string[]>> = {
  planner: [paths.orders, `${paths.orders}?view=all`, paths.newOrder, paths.importOrders],
  admin: [paths.adminUsers],
  supervisor: [paths.loads, paths.moulds],
  sales: [paths.sales, paths.dispatch],
};

/** Pages of one order, chosen from the demo data when the test runs: an order on the floor. */
const ORDER_PAGES: Partial<Record<OfficeRole, (context: BrowserContext) => Promise<string[]>>> = {
  // an order still at its gates (payment, proof, release) and one on the floor (routing, travellers)
  planner: async (context) => {
    const rows = (await (await context.request.get(`${base()}/api/orders`)).json()) as { id: string; status: string }[];
    const gated = rows.find((o) => o.status === 'awaiting_proof' || o.status === 'awaiting_payment') ?? rows[0];
    const onFloor = rows.find((o) => o.status === 'in_production') ?? rows[0];
    return [paths.order(gated.id), paths.order(onFloor.id)];
  },
  sales: async (context) => {
    const rows = (await (await context.request.get(`${base()}/api/sales/orders?limit=200`)).json()) as { id: string; status: string }[];
    const onFloor = rows.find((o) => o.status === 'in_production') ?? rows[0];
    const dispatch = (await (await context.request.get(`${base()}/api/dispatch/orders`)).json()) as { id: string; finished: number }[];
    const packing = dispatch.find((o) => o.finished > 0) ?? dispatch[0];
    return [paths.salesOrder(onFloor.id), paths.dispatchOrder(packing.id)];
  },
};

// Words that stay in Chinese text: the product's name, the language switch's "English", the
// trade's abbreviations and units, and the yes a CSV cell takes.
const KEEP = new Set(['Trayce', 'English', 'FPY', 'WIP', 'CSV', 'QR', 'PDF', 'PIN', 'min', 'pcs', 'yes']);

async function signIn(context: BrowserContext, role: OfficeRole, locale: Locale) {
  const login = await context.request.post(`${base()}/api/auth/login`, { data: { email: `${role}@tallowmere.test`, password: DEMO_PASSWORD } });
  expect(login.status()).toBe(200);
  const set = await context.request.put(`${base()}/api/auth/me/locale`, { data: { locale }, headers: { origin: base() } });
  expect(set.status()).toBe(200);
}

/** Text the factory and its customers wrote: names, titles, e-mails. */
async function dataWords(context: BrowserContext, orderIds: string[] = []): Promise<string[]> {
  const out: string[] = [];
  const me = await context.request.get(`${base()}/api/auth/me`);
  if (me.ok()) out.push(((await me.json()) as { user: { name: string } }).user.name);
  const orders = await context.request.get(`${base()}/api/orders`);
  if (orders.ok()) for (const o of (await orders.json()) as { customer: string; title: string }[]) out.push(o.customer, o.title);
  const users = await context.request.get(`${base()}/api/users`);
  if (users.ok()) for (const u of (await users.json()) as { name: string; email: string }[]) out.push(u.name, u.email);
  // what sales sees of every order: customers, titles, tracking numbers, carriers, contacts and people
  const sales = await context.request.get(`${base()}/api/sales/orders?limit=200`);
  if (sales.ok())
    for (const o of (await sales.json()) as { customer: string; title: string; trackingNumbers: string[] }[])
      out.push(o.customer, o.title, ...o.trackingNumbers);
  for (const id of orderIds) {
    // what people wrote on the order page: colours, routing step names (the factory's own
    // templates), file names, payment references, notes and the people who did things
    const od = await context.request.get(`${base()}/api/orders/${id}`);
    if (od.ok()) {
      const o = (await od.json()) as {
        spec: { colours: { name: string; ref?: string }[]; notes: string };
        routing: { name: string }[];
        trays: { stepName: string | null }[];
        moulds: { stepName: string | null }[];
        payments: { reference: string | null; note: string | null; recordedBy: string | null }[];
        proofs: { originalName: string; uploadedBy: string | null; approvedBy: string | null; approvalNote: string | null; changesComment: string | null }[];
        history: { by: string | null }[];
        holdReason: string | null;
        payment: { currency: string };
      };
      out.push(
        ...o.spec.colours.flatMap((c) => [c.name, c.ref ?? '']),
        o.spec.notes,
        ...o.routing.map((r) => r.name),
        ...[...o.trays, ...o.moulds].map((x) => x.stepName ?? ''),
        ...o.payments.flatMap((x) => [x.reference ?? '', x.note ?? '', x.recordedBy ?? '']),
        ...o.proofs.flatMap((x) => [x.originalName, x.uploadedBy ?? '', x.approvedBy ?? '', x.approvalNote ?? '', x.changesComment ?? '']),
        ...o.history.map((h) => h.by ?? ''),
        o.holdReason ?? '',
        // the ISO 4217 code the order is priced in
        o.payment.currency,
      );
    }
    const d = await context.request.get(`${base()}/api/sales/orders/${id}`);
    if (!d.ok()) continue;
    const o = (await d.json()) as {
      contact: { contactName: string | null };
      salesOwner: { name: string } | null;
      history: { who: string | null }[];
      shipments: { carrier: string; trackingNumber: string; cartons?: unknown }[];
    };
    out.push(
      o.contact.contactName ?? '',
      o.salesOwner?.name ?? '',
      ...o.history.map((h) => h.who ?? ''),
      ...o.shipments.flatMap((x) => [x.carrier, x.trackingNumber]),
    );
  }
  return out.sort((a, b) => b.length - a.length);
}

/** English words on the page that are not data, abbreviations or values to type (code). */
async function englishWords(page: Page, data: string[]): Promise<string[]> {
  const text = await page.evaluate(() => {
    const parts: string[] = [];
    const walker = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT);
    for (let n = walker.nextNode(); n; n = walker.nextNode()) {
      const el = n.parentElement;
      if (!el || el.closest('code, script, style, [hidden]')) continue;
      // the customer picker lists customers' own names
      if (el.closest('option') && el.closest('select')?.querySelector('option[value=""]') && !el.closest('option')?.value.match(/^[a-z_]+$/)) continue;
      parts.push(n.textContent ?? '');
    }
    for (const el of document.querySelectorAll<HTMLElement>('[aria-label], [placeholder], [title]')) {
      // inside role="img" the children are presentational (WAI-ARIA 1.2): the chart library's own
      // labels of its legend icons are never read out; the img's own label is ours and is checked
      if (el.parentElement?.closest('[role="img"]')) continue;
      // a textarea's placeholder is an example file, in the file's own column names and values
      parts.push(el.getAttribute('aria-label') ?? '', el.tagName === 'TEXTAREA' ? '' : (el.getAttribute('placeholder') ?? ''), el.getAttribute('title') ?? '');
    }
    return parts.join('\n');
  });
  let rest = text;
  for (const d of data) if (d) rest = rest.split(d).join(' ');
  rest = rest.replace(/\S+@\S+/g, ' ').replace(/#[0-9a-f]{6}/gi, ' ');
  return [...new Set((rest.match(/[A-Za-z]{3,}/g) ?? []).filter((w) => !KEEP.has(w)))];
}

async function settled(page: Page) {
  await page.getByRole('heading').first().waitFor({ timeout: 15_000 });
  await page.waitForFunction(() => !document.querySelector('[aria-busy="true"], [role="progressbar"]'), undefined, { polling: 100 });
}

describe("office screens in each person's language", () => {
  it('the sign-in page follows its language switch and remembers it', async () => {
    const context = await browser.newContext({ viewport: DESKTOP, locale: 'en-GB' });
    const page = await context.newPage();
    await page.goto(`${base()}${paths.signIn}`);
    await page.getByRole('button', { name: '简体中文' }).click();
    await page.getByRole('button', { name: '登录' }).waitFor();
    expect(await englishWords(page, [])).toEqual([]);
    await screenshot(page, 'office-sign-in-zh-CN');
    await page.reload();
    await page.getByRole('button', { name: '登录' }).waitFor();
    expect(await page.evaluate(() => document.documentElement.lang)).toBe('zh-CN');
    await context.close();
  });

  for (const role of ROLES) {
    it(`${role}: first screen in both languages, translated screens without English`, async () => {
      for (const locale of ['en', 'zh-CN'] as const) {
        const context = await browser.newContext({ viewport: DESKTOP, bypassCSP: true });
        try {
          await signIn(context, role, locale);
          const page = await context.newPage();
          await page.goto(`${base()}${roleHome[role]}`);
          await settled(page);
          expect(await page.evaluate(() => document.documentElement.lang)).toBe(locale);
          // the menu fits one row at 1440 x 900
          const nav = await page.getByRole('navigation').first().boundingBox();
          expect(nav!.height, `${role} menu height`).toBeLessThan(60);
          await screenshot(page, `office-${role}-${locale}`);
          if (locale === 'zh-CN') {
            const orderPages = (await ORDER_PAGES[role]?.(context)) ?? [];
            const data = await dataWords(
              context,
              orderPages.map((r) => r.split('/').at(-1)!),
            );
            for (const route of [...(TRANSLATED[role] ?? []), ...orderPages]) {
              await page.goto(`${base()}${route}`);
              await settled(page);
              expect(await englishWords(page, data), `${route} as ${role}`).toEqual([]);
              await screenshot(page, `office-${role}-zh-CN${route.replace(/[/?=]+/g, '-').replace(/-([0-9a-f]{8})[0-9a-f-]{28}$/, '-order-$1')}`);
            }
          }
        } finally {
          // the demo people stay in English for the other browser tests
          await context.request.put(`${base()}/api/auth/me/locale`, { data: { locale: 'en' }, headers: { origin: base() } });
          await context.close();
        }
      }
    });
  }
});
