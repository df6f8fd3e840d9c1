import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser, screenshot, signInAs, DESKTOP, PHONE } from '../support/browser';
import { DEMO_PASSWORD } from '../../server/seed/demo-people';

// From quote to order in the browser: sales prices a quote on the office screen (1440 × 900) and
// sends it; the customer opens the link on her phone (390 × 844), picks a quantity and accepts
// with her name, and lands on her order page with the price to pay. Then the manager reads the
// quoted-against-actual report and an order's costing card.
const base = () => process.env.TRAYCE_E2E_URL!;
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => browser?.close());

describe('a quote from the sales screen to the customer’s phone', () => {
  it('prices, sends, and is accepted on a phone', async () => {
    const office = await browser.newContext({ viewport: DESKTOP, locale: 'en-GB' });
    const page = await signInAs(office, base(), 'sales@tallowmere.test', DEMO_PASSWORD);
    await page.goto(`${base()}/quotes/new`);
    await page.getByRole('heading', { name: 'New quote' }).waitFor();
    await page.getByLabel('Customer', { exact: true }).fill('Invented Marsh Harriers Rowing Club');
    await page.getByLabel('Contact name').fill('Odile Brenner');
    await page.getByLabel('Contact e-mail').fill('odile@marsh-harriers.example');
    await page.getByLabel('Title').fill('Harrier regatta pin 30 mm');
    await page.getByLabel('Size (longest side, mm)').fill('30');
    await page.getByLabel('Height (mm)').fill('26');
    await page.getByLabel('Colour 1', { exact: true }).fill('Reed green');
    await page.getByRole('button', { name: 'Add a colour' }).click();
    await page.getByLabel('Colour 2', { exact: true }).fill('Harrier brown');
    // a quantity out of order is refused on the form, with the shared schema's words
    await page.getByLabel('Quantity 5').fill('50');
    await page.getByRole('button', { name: 'Price and save' }).click();
    await page.getByText('Quantities go up from left to right').waitFor();
    await page.getByLabel('Quantity 5').fill('2500');
    await page.getByRole('button', { name: 'Price and save' }).click();

    await page.waitForURL(/\/quotes\/[0-9a-f-]{36}$/);
    const lines = page.getByTestId('quote-lines');
    await lines.waitFor();
    await expect(lines.locator('tbody tr').count()).resolves.toBe(5);
    // the unit price falls down the breaks (read from the screen)
    const units = await lines.locator('tbody tr td:nth-child(3)').allTextContents();
    const values = units.map((u) => Number(u.replace(/[^0-9.]/g, '')));
    for (let i = 1; i < values.length; i++) expect(values[i]).toBeLessThan(values[i - 1]!);
    await page.getByTestId('breakdown').waitFor();
    await expect(page.getByTestId('breakdown').textContent()).resolves.toContain('Oven cycles (2)');
    expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(0);
    await screenshot(page, 'quote-1-sales-priced');

    await page.getByRole('button', { name: 'Send to the customer' }).click();
    const sent = page.getByTestId('sent-link');
    await sent.waitFor();
    const url = /(https?:\/\/\S+\/quote\/[A-Za-z0-9_-]+)/.exec((await sent.textContent()) ?? '')![1]!;
    await screenshot(page, 'quote-2-sales-sent');

    const phone = await browser.newContext({ viewport: PHONE, isMobile: true, hasTouch: true, deviceScaleFactor: 2, locale: 'en-GB' });
    const mobile = await phone.newPage();
    const res = await mobile.goto(url.replace(/^https?:\/\/[^/]+/, base()));
    expect(res?.headers()['x-robots-tag']).toMatch(/noindex/);
    await mobile.getByRole('heading', { level: 1, name: 'Harrier regatta pin 30 mm' }).waitFor();
    await mobile.getByTestId('break-500').waitFor();
    await expect(mobile.getByTestId('break-500').textContent()).resolves.toMatch(/Expected to ship .* at the latest in 85 of 100 cases/);
    const body = (await mobile.locator('body').textContent()) ?? '';
    for (const internal of ['Labour', 'Margin', 'Oven cycles', 'Rosa Kettering']) expect(body).not.toContain(internal);
    expect(await mobile.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(0);
    await screenshot(mobile, 'quote-3-phone-quote');

    await mobile.getByTestId('break-500').click();
    await mobile.getByLabel('Your name').fill('Odile Brenner');
    const accept = mobile.getByRole('button', { name: /^Accept 500 pieces for / });
    await screenshot(mobile, 'quote-4-phone-chosen');
    await accept.click();
    await mobile.waitForURL(/\/status\/[A-Za-z0-9_-]+$/);
    await mobile.getByRole('heading', { level: 1, name: 'Harrier regatta pin 30 mm' }).waitFor();
    await mobile.getByTestId('amount-due').waitFor();
    await screenshot(mobile, 'quote-5-phone-order');

    // the quote now says it was accepted, on both sides; the link does not take a second accept
    await mobile.goto(url.replace(/^https?:\/\/[^/]+/, base()));
    await mobile.getByTestId('quote-accepted').waitFor();
    await expect(mobile.getByRole('button', { name: /^Accept/ }).count()).resolves.toBe(0);
    await page.reload();
    await page.getByTestId('accepted').waitFor();
    await expect(page.getByTestId('accepted').textContent()).resolves.toContain('Accepted by Odile Brenner');
    await phone.close();
    await office.close();
  });
});

describe('quoted against actual for the manager', () => {
  it('reads the report by process and colours and an order’s costing card', async () => {
    const office = await browser.newContext({ viewport: DESKTOP, locale: 'en-GB' });
    const page = await signInAs(office, base(), 'manager@tallowmere.test', DEMO_PASSWORD);
    await page.goto(`${base()}/reports/costing`);
    await page.getByRole('link', { name: 'Quoted vs actual' }).waitFor();
    await page.getByTestId('costing-summary').waitFor();
    await expect(page.getByTestId('costing-summary').textContent()).resolves.toMatch(/\d+ orders shipped: quoted .*, actual .*, variance/);
    await screenshot(page, 'costing-1-report');
    const first = page.getByRole('table').last().locator('tbody tr th a').first();
    await first.click();
    await page.waitForURL(/\/orders\/[0-9a-f-]{36}$/);
    const card = page.getByTestId('costing-card');
    await card.waitFor();
    await card.getByRole('heading', { name: 'Quoted against actual' }).waitFor();
    await card.scrollIntoViewIfNeeded();
    await screenshot(page, 'costing-2-order-card');
    await office.close();
  });
});

describe('the costing rates for the admin', () => {
  it('shows every rate in one form, refuses a bad one and saves a good one', async () => {
    const office = await browser.newContext({ viewport: DESKTOP, locale: 'en-GB' });
    const page = await signInAs(office, base(), 'admin@tallowmere.test', DEMO_PASSWORD);
    await page.goto(`${base()}/admin/costing`);
    await page.getByRole('heading', { name: 'Costing rates' }).waitFor();
    // the published density of iron (CRC Handbook) is the default
    await expect(page.getByLabel('Iron').first().inputValue()).resolves.toBe('7.874');
    const margin = page.getByLabel('Margin, % of the price');
    const before = await margin.inputValue();
    await margin.fill('95');
    await page.getByRole('button', { name: 'Save the rates' }).click();
    await page.getByRole('alert').filter({ hasText: /90/ }).first().waitFor();
    await margin.fill('32');
    await page.getByRole('button', { name: 'Save the rates' }).click();
    await page.getByText('Saved. The next quote is priced with these rates.').waitFor();
    const saved = (await (await office.request.get(`${base()}/api/admin/costing`)).json()) as { marginPct: number };
    expect(saved.marginPct).toBe(32);
    await screenshot(page, 'costing-3-admin-rates');
    await office.request.put(`${base()}/api/admin/costing`, { data: { marginPct: Number(before) } });
    await office.close();
  });
});
