// Accessibility of every screen, checked by axe-core (WCAG 2.0 A/AA and 2.1 AA rules) in Chromium
// on the demo factory: every office route at 1440 x 900 in both languages (each as two different
// roles), the station tablet at
// 1024 x 768 in both its languages (paired, signed in, a tray open, a refusal, offline), the wall in
// its dark and light themes, and the customer's status page. The tablet also keeps the house rules
// a browser can see: touch targets at least 44 x 44 px, a visible focus outline, a name on every control.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { PNG } from 'pngjs';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser, SCREENSHOTS, DESKTOP, PHONE, TABLET, WALL } from '../support/browser';
import { expectNoAxeViolations, focusOutlines, namelessControls, smallTargets } from '../support/axe';
import { DEMO_PASSWORD } from '../../server/seed/demo-people';
import { paths } from '../../src/config/paths';
import type { Role } from '@shared/domain/vocabulary';

const base = () => process.env.TRAYCE_E2E_URL!;
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => browser?.close());

/** The languages each screen group is offered in. The office screens are English today; adding a language to them is one entry here. */
const OFFICE_LOCALES = ['en', 'zh-CN'] as const;
const TABLET_LOCALES = ['en', 'zh-CN'] as const;

/** Ids from the demo factory, found through the API. */
interface DemoIds {
  orderId: string;
  trayId: string;
  salesOrderId: string;
  /** a quote made for this walk (the demo factory has none) */
  quoteId: string;
  dispatchOrderId: string | null;
}

/** The routes each office role can open (src/config/paths.ts and src/app/router.tsx). */
function routesOf(role: Exclude<Role, 'operator'>, ids: DemoIds): string[] {
  const reports = ['/reports/lead-time', '/reports/cycle-time', '/reports/flow', '/reports/on-time', '/reports/yield'];
  const floor = [paths.floor, paths.scanExceptions];
  const orders = [paths.orders, paths.order(ids.orderId), paths.tray(ids.trayId), paths.moulds];
  const sales = [paths.sales, paths.salesOrder(ids.salesOrderId)];
  const quotes = [paths.quotes, '/quotes/new', `/quotes/${ids.quoteId}`];
  const dispatch = [paths.dispatch, ...(ids.dispatchOrderId ? [paths.dispatchOrder(ids.dispatchOrderId)] : [])];
  switch (role) {
    case 'planner':
      return [
        ...floor,
        ...orders,
        paths.newOrder,
        paths.importOrders,
        paths.loads,
        paths.reports,
        ...reports,
        ...sales,
        paths.salesWhatIf,
        ...quotes,
        ...dispatch,
      ];
    case 'supervisor':
      return [...floor, ...orders, paths.loads, ...dispatch];
    case 'manager':
      return [...floor, ...orders, paths.loads, paths.reports, ...reports, '/reports/costing', ...sales, paths.salesWhatIf];
    case 'sales':
      return ['/reports/lead-time', '/reports/on-time', ...sales, paths.salesWhatIf, ...quotes, ...dispatch];
    case 'admin':
      return [
        paths.adminUsers,
        paths.adminStations,
        paths.adminDevices,
        paths.adminReasonCodes,
        paths.adminBackups,
        paths.adminOutbox,
        paths.adminCalendar,
        paths.adminRoutingTemplates,
        paths.adminCosting,
        ...floor,
        ...orders,
        paths.reports,
        ...reports,
        '/reports/costing',
        ...sales,
        ...quotes,
        ...dispatch,
      ];
  }
}

async function apiAs(context: BrowserContext, email: string) {
  const res = await context.request.post(`${base()}/api/auth/login`, { data: { email, password: DEMO_PASSWORD } });
  expect(res.status()).toBe(200);
}

/** A quote priced by sales on the demo factory, sent to its customer: its id and the customer's link. */
async function makeQuote(): Promise<{ id: string; url: string }> {
  const context = await browser.newContext({ bypassCSP: true });
  try {
    await apiAs(context, 'sales@tallowmere.test');
    const validUntil = new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10);
    const created = await context.request.post(`${base()}/api/quotes`, {
      headers: { origin: base() },
      data: {
        customer: 'Invented Lantern Society',
        contactName: 'Ida Marlow',
        contactEmail: 'ida@lantern-society.test',
        spec: {
          title: 'Lantern walk pin',
          process: 'hard_enamel',
          material: 'iron',
          sizeMm: 25,
          heightMm: 22,
          thicknessMm: 1.5,
          colours: [{ name: 'Amber' }, { name: 'Night blue', ref: 'NB-2' }],
          plating: 'gold',
          backing: { type: 'butterfly_clutch', count: 1 },
          packaging: 'individual_bag',
        },
        quantities: [100, 500],
        validUntil,
      },
    });
    expect(created.status(), await created.text()).toBe(201);
    const { id } = (await created.json()) as { id: string };
    const sent = await context.request.post(`${base()}/api/quotes/${id}/send`, { headers: { origin: base() }, data: {} });
    expect(sent.status(), await sent.text()).toBeLessThan(300);
    const { url } = (await sent.json()) as { url: string };
    return { id, url };
  } finally {
    await context.close();
  }
}

/** Sets the language saved with the signed-in person's account (it decides the office screens' language). */
async function setLocale(context: BrowserContext, locale: 'en' | 'zh-CN') {
  const res = await context.request.put(`${base()}/api/auth/me/locale`, { headers: { origin: base() }, data: { locale } });
  expect(res.status(), await res.text()).toBeLessThan(300);
}

async function demoIds(): Promise<DemoIds> {
  const context = await browser.newContext({ bypassCSP: true });
  try {
    await apiAs(context, 'admin@tallowmere.test');
    const get = async <T>(p: string) => {
      const r = await context.request.get(`${base()}/api${p}`);
      expect(r.status(), p).toBe(200);
      return (await r.json()) as T;
    };
    const orders = await get<{ id: string; status: string }[]>('/orders');
    const onFloor = orders.find((o) => o.status === 'in_production') ?? orders[0];
    const detail = await get<{ trays: { id: string }[] }>(`/orders/${onFloor.id}`);
    const dispatch = await get<{ id: string }[]>('/dispatch/orders');
    return {
      orderId: onFloor.id,
      trayId: detail.trays[0].id,
      salesOrderId: onFloor.id,
      dispatchOrderId: dispatch[0]?.id ?? null,
      quoteId: (await makeQuote()).id,
    };
  } finally {
    await context.close();
  }
}

/** Waits until the page has drawn its content: a top heading, and no loading placeholder left. */
async function settled(page: Page, label: string) {
  await page
    .getByRole('heading')
    .first()
    .waitFor({ timeout: 30_000 })
    .catch((e: Error) => {
      throw new Error(`${label}: no heading drawn (${e.message.split('\n')[0]})`);
    });
  await page.waitForFunction(() => !document.querySelector('[aria-busy="true"], [data-testid="loading"]'), undefined, { polling: 100 });
}

describe('accessibility (axe-core, WCAG 2.1 A/AA)', () => {
  it('the sign-in screen', async () => {
    for (const locale of OFFICE_LOCALES) {
      const context = await browser.newContext({ bypassCSP: true, viewport: DESKTOP, locale });
      const page = await context.newPage();
      await page.goto(`${base()}${paths.signIn}`);
      // the sign-in page speaks the browser's language until someone chooses
      await page.getByRole('button', { name: locale === 'en' ? 'Sign in' : '登录', exact: true }).waitFor();
      await expectNoAxeViolations(page, `sign-in (${locale})`);
      await context.close();
    }
  });

  // one test per language and role, so a slow machine gets the whole time budget for each
  const officeRoles = ['planner', 'supervisor', 'manager', 'sales', 'admin'] as const;
  // Each distinct office route is walked once per language. English opens it as the first role
  // that can (in the order above), Chinese as the last, so a screen that differs by role is seen
  // as two different roles, and each role's menu is walked in both languages.
  const walkOf = (locale: (typeof OFFICE_LOCALES)[number], role: (typeof officeRoles)[number], demo: DemoIds): string[] => {
    const others = locale === 'en' ? officeRoles.slice(0, officeRoles.indexOf(role)) : officeRoles.slice(officeRoles.indexOf(role) + 1);
    const seen = new Set(others.flatMap((r) => routesOf(r, demo)));
    const mine = routesOf(role, demo).filter((route) => !seen.has(route));
    // a role whose routes all belong to another still has its own menu walked, on its first screen
    return mine.length ? mine : routesOf(role, demo).slice(0, 1);
  };
  let ids: Promise<DemoIds> | undefined;
  it.each(OFFICE_LOCALES.flatMap((locale) => officeRoles.map((role) => [locale, role] as const)))(
    'the office routes walked in %s as %s',
    async (locale, role) => {
      ids ??= demoIds();
      const context = await browser.newContext({ bypassCSP: true, viewport: DESKTOP, locale });
      await apiAs(context, `${role}@tallowmere.test`);
      // the person's own language decides the screens; the demo people read English, so put it back after
      await setLocale(context, locale);
      try {
        const page = await context.newPage();
        for (const route of walkOf(locale, role, await ids)) {
          await page.goto(`${base()}${route}`);
          await settled(page, `${route} as ${role}`);
          if (route === paths.floor) await page.locator('section[data-kind]').first().waitFor();
          expect(new URL(page.url()).pathname, `${role} stays on ${route}`).toBe(route);
          await expectNoAxeViolations(page, `${route} as ${role} (${locale})`);
        }
      } finally {
        await setLocale(context, 'en');
        await context.close();
      }
    },
    600_000,
  );

  it('the wall in its dark and light themes, with screenshots at 1920 x 1080 and a quarter of that', async () => {
    const context = await browser.newContext({ bypassCSP: true, viewport: WALL });
    await apiAs(context, 'supervisor@tallowmere.test');
    const page = await context.newPage();
    await page.goto(`${base()}${paths.wall}`);
    await page.getByRole('heading', { name: 'Floor now' }).waitFor();
    await page.getByTestId('stream-status').filter({ hasText: 'Live' }).waitFor();
    for (const theme of ['dark', 'light'] as const) {
      if ((await page.getByRole('button', { name: 'Light screen' }).count()) === (theme === 'dark' ? 0 : 1)) {
        await page.getByRole('button', { name: theme === 'dark' ? 'Dark screen' : 'Light screen' }).click();
      }
      await page.getByRole('button', { name: theme === 'dark' ? 'Light screen' : 'Dark screen' }).waitFor();
      await expectNoAxeViolations(page, `/wall (${theme})`);
      await saveWithQuarter(page, `a11y-wall-${theme}`);
    }
    // the demo floor has empty stations, and they say so in words
    expect(await page.locator('section[data-idle="yes"]').count()).toBeGreaterThan(0);
    await page.goto(`${base()}${paths.floor}`);
    await page.getByText('Live: updates as trays are scanned').waitFor();
    await expectNoAxeViolations(page, '/floor at 1920 x 1080');
    await saveWithQuarter(page, 'a11y-floor');
    await context.close();
  });

  it('the customer status page', async () => {
    const ids = await demoIds();
    const office = await browser.newContext({ bypassCSP: true, viewport: DESKTOP });
    await apiAs(office, 'sales@tallowmere.test');
    const share = await office.request.post(`${base()}/api/orders/${ids.salesOrderId}/share`, { headers: { origin: base() } });
    expect(share.status()).toBe(201);
    const { token } = (await share.json()) as { token: string };
    await office.close();
    const context = await browser.newContext({ bypassCSP: true, viewport: DESKTOP });
    const page = await context.newPage();
    await page.goto(`${base()}${paths.publicStatus(token)}`);
    await page.getByTestId('stage').waitFor();
    await expectNoAxeViolations(page, 'public status page (en)');
    await page.locator('button[lang="zh-CN"]').click();
    await page.locator('button[lang="zh-CN"][aria-pressed="true"]').waitFor();
    await expectNoAxeViolations(page, 'public status page (zh-CN)');
    await context.close();
  });

  it('the customer quote page, in both languages', async () => {
    const { url } = await makeQuote();
    const context = await browser.newContext({ bypassCSP: true, viewport: PHONE });
    const page = await context.newPage();
    await page.goto(`${base()}${new URL(url).pathname}`);
    await page.getByRole('heading').first().waitFor();
    await page.locator('button[lang="zh-CN"]').waitFor();
    await expectNoAxeViolations(page, 'customer quote page (en)');
    await page.locator('button[lang="zh-CN"]').click();
    await page.locator('button[lang="zh-CN"][aria-pressed="true"]').waitFor();
    await expectNoAxeViolations(page, 'customer quote page (zh-CN)');
    await context.close();
  });

  for (const locale of TABLET_LOCALES) {
    it(`the station tablet in ${locale}: paired, signed in, a tray open, a refusal, offline`, async () => {
      const t =
        locale === 'en'
          ? {
              pairCode: 'Pairing code',
              pairSubmit: 'Pair tablet',
              paired: 'Paired as',
              badge: 'Badge',
              confirm: 'Confirm',
              pin: 'PIN',
              signIn: 'Sign in',
              finish: 'Finish',
              notStarted: /not started/i,
              operator: { badge: 'B-201', pin: '1357' },
            }
          : {
              pairCode: '配对码',
              pairSubmit: '配对',
              paired: '已配对为',
              badge: '工牌',
              confirm: '确认',
              pin: '密码',
              signIn: '登录',
              finish: '完成',
              notStarted: /尚未开始/,
              operator: { badge: 'B-202', pin: '2580' },
            };
      const admin = await browser.newContext({ bypassCSP: true });
      await apiAs(admin, 'admin@tallowmere.test');
      const stations = (await (await admin.request.get(`${base()}/api/stations`)).json()) as { id: string; code: string }[];
      const station = stations.find((s) => s.code === 'PST-1') ?? stations[0];
      const created = await admin.request.post(`${base()}/api/devices`, {
        headers: { origin: base() },
        data: { name: `A11y tablet ${crypto.randomUUID().slice(0, 6)}`, stationId: station.id, locale, idleMinutes: 30 },
      });
      expect(created.status()).toBe(201);
      const { pairingCode } = (await created.json()) as { pairingCode: string };
      await admin.close();

      const context = await browser.newContext({ bypassCSP: true, viewport: TABLET, locale });
      const page = await context.newPage();
      const check = async (state: string) => {
        const label = `station tablet, ${state} (${locale})`;
        await expectNoAxeViolations(page, label);
        expect(await namelessControls(page), `${label}: controls without a name`).toEqual([]);
        expect(await smallTargets(page), `${label}: touch targets under 44 x 44 px`).toEqual([]);
      };

      await page.goto(`${base()}${paths.pair}`);
      // before pairing the screen follows the browser's language
      await page.getByLabel(t.pairCode).waitFor();
      await check('pairing');
      await page.getByLabel(t.pairCode).fill(pairingCode);
      await page.getByRole('button', { name: t.pairSubmit, exact: true }).click();
      await page.getByText(t.paired).waitFor();
      await page.goto(`${base()}${paths.station}`);
      await page.getByLabel(t.badge, { exact: true }).waitFor();
      await check('badge sign-in');
      const focus = await focusOutlines(page, 3);
      expect(focus.length).toBeGreaterThan(0);
      for (const f of focus) expect(f.visible, `focus outline on ${f.element}: ${f.outline}`).toBe(true);
      // a demo operator who reads the language under test (their account's language decides after sign-in)
      await page.getByLabel(t.badge, { exact: true }).fill(t.operator.badge);
      await page.getByRole('button', { name: t.confirm }).click();
      await page.getByRole('textbox', { name: t.pin }).waitFor();
      await check('PIN');
      await page.getByRole('textbox', { name: t.pin }).fill(t.operator.pin);
      await page.getByRole('button', { name: t.signIn, exact: true }).click();
      await page.getByTestId('station-name').waitFor();
      await page.getByTestId('queue-row').first().waitFor();
      await check('signed in, the station list');
      for (const f of await focusOutlines(page, 4)) expect(f.visible, `focus outline on ${f.element}: ${f.outline}`).toBe(true);

      // a waiting tray opened, then a refusal: finishing what was never started
      // (held trays are listed last, and a held tray is refused for its hold, so take the last one ready)
      const waiting = page.locator('section[aria-labelledby="list-waiting"] [data-testid="queue-row"][data-held="no"]');
      const number = (await waiting.last().locator('span.font-mono').textContent())!.trim();
      await waiting.last().click();
      await page.getByRole('heading', { name: number }).waitFor();
      await check('a tray open');
      const finish = page.getByRole('button', { name: t.finish, exact: true });
      expect(await finish.isEnabled(), 'Finish can be pressed on a waiting tray (the tablet refuses it itself)').toBe(true);
      await finish.click();
      await page.getByTestId('feedback').getByText(t.notStarted).waitFor();
      await check('a refusal shown');

      await context.setOffline(true);
      await page.getByTestId('net-status').and(page.locator('[data-online="no"]')).waitFor();
      await check('offline');
      await context.setOffline(false);
      await context.close();
    });
  }
});

/** Saves a full-size screenshot and a copy scaled to a quarter (box filter over 4 x 4 pixels). */
async function saveWithQuarter(page: Page, name: string) {
  fs.mkdirSync(SCREENSHOTS, { recursive: true });
  const buf = await page.screenshot({ path: path.join(SCREENSHOTS, `${name}-1920x1080.png`) });
  const src = PNG.sync.read(buf);
  const w = Math.floor(src.width / 4);
  const h = Math.floor(src.height / 4);
  const out = new PNG({ width: w, height: h });
  for (let y = 0; y < h; y++) {
    for (let x = 0; x < w; x++) {
      for (let c = 0; c < 4; c++) {
        let sum = 0;
        for (let dy = 0; dy < 4; dy++) for (let dx = 0; dx < 4; dx++) sum += src.data[((y * 4 + dy) * src.width + x * 4 + dx) * 4 + c];
        out.data[(y * w + x) * 4 + c] = Math.round(sum / 16);
      }
    }
  }
  fs.writeFileSync(path.join(SCREENSHOTS, `${name}-480x270.png`), PNG.sync.write(out));
}
