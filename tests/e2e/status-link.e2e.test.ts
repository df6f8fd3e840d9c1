import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser, screenshot, DESKTOP, PHONE } from '../support/browser';
import { DEMO_PASSWORD } from '../../server/seed/demo-people';
import type { SalesOrderRow } from '@shared/schemas/shipping';

const base = () => process.env.TRAYCE_E2E_URL!;
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => browser?.close());

describe('customer status link', () => {
  it('sales makes a link; the customer opens it on a phone and sees the stage and the ship date', async () => {
    const office = await browser.newContext({ viewport: DESKTOP });
    const signIn = await office.request.post(`${base()}/api/auth/login`, { data: { email: 'sales@tallowmere.test', password: DEMO_PASSWORD } });
    expect(signIn.status()).toBe(200);

    // An order of the demo factory that is on the floor and has a projected ship date.
    const list = (await (await office.request.get(`${base()}/api/sales/orders?limit=200`)).json()) as SalesOrderRow[];
    const order = list.find((o) => o.status === 'in_production' && o.projectedShipAt && o.stage !== 'Artwork and moulds');
    expect(order, 'the demo factory has an order in production').toBeDefined();

    const page = await office.newPage();
    await page.goto(`${base()}/sales`);
    await page.getByRole('searchbox', { name: 'Find an order' }).fill(order!.number);
    await page.getByRole('table').getByRole('link', { name: order!.number, exact: true }).click();
    await page.getByRole('heading', { name: new RegExp(`^${order!.number}:`) }).waitFor();
    await expect(page.getByTestId('stage-text').textContent()).resolves.toContain(order!.stage);
    await page.getByRole('button', { name: 'Make a status link' }).click();
    const url = await page.getByLabel('Status link').inputValue();
    expect(url).toMatch(/\/status\/[A-Za-z0-9_-]{43}$/);
    await screenshot(page, 'status-link-sales');

    // A fresh browser: no session, phone size.
    const phone = await browser.newContext({ viewport: PHONE, isMobile: true, hasTouch: true, deviceScaleFactor: 2 });
    const customer = await phone.newPage();
    const res = await customer.goto(url);
    expect(res?.headers()['x-robots-tag']).toMatch(/noindex/);
    await customer.getByTestId('stage').waitFor();
    await expect(customer.getByTestId('stage').textContent()).resolves.toBe(`Now: ${order!.stage}`);
    await expect(customer.getByRole('heading', { level: 1 }).textContent()).resolves.toBe(order!.title);
    // The projected date of the order written out in the page's language (English as en-GB writes it).
    const expected = await customer.evaluate(
      (iso) =>
        new Date(iso).toLocaleDateString(document.documentElement.lang === 'zh-CN' ? 'zh-CN' : 'en-GB', {
          weekday: 'long',
          day: 'numeric',
          month: 'long',
          year: 'numeric',
        }),
      order!.projectedShipAt!,
    );
    await expect(customer.getByTestId('ship-date').textContent()).resolves.toBe(expected);
    await expect(customer.locator('meta[name="robots"]').getAttribute('content')).resolves.toMatch(/noindex/);
    // Nothing for the customer beyond her order: no app navigation, no sign-in.
    await expect(customer.getByRole('navigation').count()).resolves.toBe(0);
    // Fits the phone: no sideways scrolling.
    const overflow = await customer.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(customer, 'status-link-phone');

    // Sales withdraws the link; the customer's page says so.
    page.once('dialog', (d) => void d.accept());
    await page.getByRole('button', { name: 'Withdraw all links' }).click();
    await page
      .getByText(/^Withdrawn /)
      .first()
      .waitFor();
    await customer.reload();
    await customer.getByRole('heading', { name: 'This link does not work any more' }).waitFor();
    await screenshot(customer, 'status-link-withdrawn');
    await phone.close();
    await office.close();
  });
});
