import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { PNG } from 'pngjs';
import { launchBrowser, screenshot, DESKTOP, PHONE } from '../support/browser';
import { DEMO_PASSWORD } from '../../server/seed/demo-people';
import type { SalesOrderRow } from '@shared/schemas/shipping';

// The customer's path on a phone: her order page from the link, the deposit paid on the local
// checkout fake, her proof approved with her name, the page in Chinese, and the production story
// of an order already on the floor.
const base = () => process.env.TRAYCE_E2E_URL!;
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => browser?.close());

const DUE = new Date(Date.now() + 60 * 86_400_000).toISOString().slice(0, 10);

function proofPng(): Buffer {
  const img = new PNG({ width: 240, height: 240 });
  for (let y = 0; y < 240; y++) {
    for (let x = 0; x < 240; x++) {
      const i = (y * 240 + x) * 4;
      const inside = (x - 120) ** 2 + (y - 120) ** 2 < 100 ** 2;
      img.data[i] = inside ? 200 : 245;
      img.data[i + 1] = inside ? 80 : 240;
      img.data[i + 2] = inside ? 42 : 230;
      img.data[i + 3] = 255;
    }
  }
  return PNG.sync.write(img);
}

describe('customer order page on a phone', () => {
  it('pays, approves the proof and reads her order in both languages', async () => {
    const office = await browser.newContext({ viewport: DESKTOP });
    expect((await office.request.post(`${base()}/api/auth/login`, { data: { email: 'planner@tallowmere.test', password: DEMO_PASSWORD } })).status()).toBe(200);
    const created = await office.request.post(`${base()}/api/orders`, {
      data: {
        customer: 'Invented Heron Cycling Club',
        title: 'Heron ride pin 28 mm',
        process: 'hard_enamel',
        material: 'iron',
        sizeMm: 28,
        quantity: 300,
        colours: [
          { name: 'Ember', hex: '#c8502a' },
          { name: 'Night', hex: '#1b2a4a' },
        ],
        plating: 'gold',
        backing: { type: 'butterfly_clutch', count: 1 },
        packaging: 'individual_bag',
        dueDate: DUE,
        notes: 'Internal: rush if the oven is free',
        priceTotal: 860,
        currency: 'EUR',
      },
    });
    expect(created.status(), await created.text()).toBe(201);
    const order = (await created.json()) as { id: string; number: string };
    const up = await office.request.post(`${base()}/api/orders/${order.id}/proofs`, {
      multipart: { file: { name: 'heron-proof.png', mimeType: 'image/png', buffer: proofPng() } },
    });
    expect(up.status()).toBe(201);
    const link = await office.request.post(`${base()}/api/orders/${order.id}/share`, { data: {} });
    const { url } = (await link.json()) as { url: string };

    const phone = await browser.newContext({ viewport: PHONE, isMobile: true, hasTouch: true, deviceScaleFactor: 2, locale: 'en-GB' });
    const page = await phone.newPage();
    const res = await page.goto(url);
    expect(res?.headers()['x-robots-tag']).toMatch(/noindex/);
    await page.getByRole('heading', { level: 1, name: 'Heron ride pin 28 mm' }).waitFor();
    await expect(page.getByTestId('amount-due').textContent()).resolves.toBe('€860.00');
    await expect(page.locator('body').textContent()).resolves.not.toContain('Internal: rush');
    await expect(page.getByRole('navigation').count()).resolves.toBe(0);
    expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(0);
    await screenshot(page, 'portal-1-to-pay');

    // the hosted checkout (here the local fake): its one form, its Pay button
    await page.getByRole('button', { name: 'Pay €860.00' }).click();
    await page.getByRole('heading', { name: 'Test checkout' }).waitFor();
    await expect(page.getByTestId('amount').textContent()).resolves.toBe('€860.00');
    await screenshot(page, 'portal-2-checkout-fake');
    await page.getByRole('button', { name: 'Pay', exact: true }).click();

    // back on her page: the payment shows once the signed webhook was recorded
    await page.waitForURL(/\/status\/[A-Za-z0-9_-]+\?paid=1$/);
    await page.getByTestId('paid').waitFor();
    await expect(page.getByTestId('paid').textContent()).resolves.toContain('€860.00');
    const detail = (await (await office.request.get(`${base()}/api/orders/${order.id}`)).json()) as {
      payments: { source: string; amount: number }[];
      openGates: string[];
    };
    expect(detail.payments).toEqual([expect.objectContaining({ source: 'checkout', amount: 860 })]);
    expect(detail.openGates).toEqual(['proof_not_approved']);

    // the proof: a name is needed to approve
    await page.getByRole('img', { name: 'Proof 1 of your artwork' }).waitFor();
    await page.getByRole('button', { name: 'Approve this proof' }).last().click();
    await page.getByText('Type your name (at least 2 letters) to approve.').waitFor();
    await screenshot(page, 'portal-3-proof');
    await page.getByLabel('Your name').fill('Ysolde Varrin');
    await page.getByRole('button', { name: 'Approve this proof' }).last().click();
    await page.getByText(/^Approved by Ysolde Varrin on /).waitFor();
    const after = (await (await office.request.get(`${base()}/api/orders/${order.id}`)).json()) as { openGates: string[]; proofs: { approvedBy: string }[] };
    expect(after.openGates).toEqual([]);
    expect(after.proofs[0]!.approvedBy).toBe('Ysolde Varrin (on the order page)');
    await screenshot(page, 'portal-4-approved');

    // the same page in Chinese, with no English words of ours left in the cards
    await page.getByRole('button', { name: '简体中文' }).click();
    await page.getByRole('heading', { name: '付款' }).waitFor();
    await expect(page.locator('html').getAttribute('lang')).resolves.toBe('zh-CN');
    await screenshot(page, 'portal-5-chinese');
    await page.getByRole('button', { name: 'English' }).click();

    // the planner releases it: her page now tells her own production story
    expect((await office.request.post(`${base()}/api/orders/${order.id}/release`, { data: { traySize: 100 } })).status()).toBe(201);
    await page.reload();
    await page.getByRole('heading', { name: 'How your pins are made' }).waitFor();
    await page.getByRole('heading', { name: 'Artwork and moulds', level: 3 }).waitFor();
    await phone.close();
    await office.close();
  });

  it('tells an order on the floor how hard enamel is done, with its own dates only', async () => {
    const office = await browser.newContext({ viewport: DESKTOP });
    expect((await office.request.post(`${base()}/api/auth/login`, { data: { email: 'sales@tallowmere.test', password: DEMO_PASSWORD } })).status()).toBe(200);
    const list = (await (await office.request.get(`${base()}/api/sales/orders?limit=200`)).json()) as (SalesOrderRow & { process?: string })[];
    const candidates = list.filter((o) => o.status === 'in_production' && !['Artwork and moulds', 'Metal forming'].includes(o.stage));
    let found: { url: string; title: string } | null = null;
    for (const o of candidates) {
      const d = (await (await office.request.get(`${base()}/api/orders/${o.id}`)).json()) as { spec: { process: string } };
      if (d.spec.process !== 'hard_enamel') continue;
      const link = (await (await office.request.post(`${base()}/api/orders/${o.id}/share`, { data: {} })).json()) as { url: string };
      found = { url: link.url, title: o.title };
      break;
    }
    expect(found, 'the demo factory has a hard-enamel order past its colours').not.toBeNull();
    const phone = await browser.newContext({ viewport: PHONE, isMobile: true, hasTouch: true, deviceScaleFactor: 2, locale: 'en-GB' });
    const page = await phone.newPage();
    await page.goto(found!.url);
    await page.getByRole('heading', { name: 'How your pins are made' }).waitFor();
    const story = page.locator('section[aria-labelledby="story"]');
    await expect(story.textContent()).resolves.toMatch(/one colour at a time.*two hours or more/);
    // nothing of the factory's people reaches her page
    const text = (await page.locator('body').textContent()) ?? '';
    for (const name of ['planner@', 'supervisor', 'operator', 'B-20']) expect(text).not.toContain(name);
    await page.getByRole('heading', { name: 'Colour', level: 3 }).scrollIntoViewIfNeeded();
    await screenshot(page, 'portal-6-story');
    await phone.close();
    await office.close();
  });
});
