// A planner takes an order from entry to printed travellers in the real app (built client,
// demo server, Debian's Chromium). The downloaded PDF is read back with an independent QR
// decoder (jsQR) and must carry the code the server gave the first tray.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { execFileSync } from 'node:child_process';
import type { Browser } from 'playwright-core';
import jsQR from 'jsqr';
import { PNG } from 'pngjs';
import { launchBrowser, screenshot, signInAs, DESKTOP } from '../support/browser';
import { DEMO_PEOPLE, DEMO_PASSWORD } from '../../server/seed/demo-people';

const base = () => process.env.TRAYCE_E2E_URL!;
let browser: Browser;
let dir: string;
beforeAll(async () => {
  browser = await launchBrowser();
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'trayce-orders-e2e-'));
});
afterAll(async () => {
  await browser?.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

function proofPng(): Buffer {
  const img = new PNG({ width: 120, height: 120 });
  for (let i = 0; i < img.data.length; i += 4) {
    const p = i / 4;
    const inside = ((p % 120) - 60) ** 2 + (Math.floor(p / 120) - 60) ** 2 < 50 ** 2;
    img.data[i] = inside ? 27 : 255;
    img.data[i + 1] = inside ? 42 : 255;
    img.data[i + 2] = inside ? 74 : 255;
    img.data[i + 3] = 255;
  }
  return PNG.sync.write(img);
}

describe('planner: order → payment → proof → release → travellers PDF', () => {
  it('goes through every gate in the browser and downloads travellers whose QR decodes', async () => {
    const planner = DEMO_PEOPLE.find((p) => p.role === 'planner')!;
    const context = await browser.newContext({ viewport: DESKTOP, acceptDownloads: true });
    const page = await signInAs(context, base(), planner.email, DEMO_PASSWORD);
    await page.waitForURL((u) => u.pathname === '/orders');

    // 1. a new order
    await page.getByRole('link', { name: 'New order' }).click();
    await page.waitForURL((u) => u.pathname === '/orders/new');
    await page.getByRole('heading', { name: 'New order' }).waitFor();
    const customer = `Brindle Cove Sailing Club ${Date.now() % 100000}`;
    await page.getByLabel('Customer').fill(customer);
    await page.getByLabel('Title').fill('Burgee pin 22 mm');
    await page.getByLabel('Process').selectOption('hard_enamel');
    await page.getByLabel('Size, longest side (mm)').fill('22');
    await page.getByLabel('Quantity ordered').fill('300');
    await page.getByLabel('Colour 1 name').fill('Harbour blue');
    await page.getByRole('button', { name: 'Add a colour' }).click();
    await page.getByLabel('Colour 2 name').fill('Signal red');
    await page.getByLabel('Colour 2 swatch').fill('#c8102e');
    await page.getByLabel('Plating').selectOption('gold');
    await page.getByLabel('Due date').fill(new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10));
    await screenshot(page, 'orders-new');
    await page.getByRole('button', { name: 'Save order' }).click();
    await page.waitForURL(/\/orders\/[0-9a-f-]{36}$/);
    const orderId = new URL(page.url()).pathname.split('/').pop()!;

    // the screen says what is missing before release
    const missing = page.getByRole('status').filter({ hasText: 'Not ready to release' });
    await expect(missing.textContent()).resolves.toMatch(/payment[\s\S]*approval of the latest proof/);

    // 2. payment
    await page.getByLabel('Amount').fill('1480.00');
    await page.getByLabel('Payment reference').fill('BT-77812');
    await page.getByRole('button', { name: 'Record payment' }).click();
    await page.getByText('BT-77812').first().waitFor();

    // 3. proof: upload and the customer's approval
    await page.getByLabel('Proof file (PDF, PNG or JPEG, up to 20 MB)').setInputFiles({ name: 'burgee-proof.png', mimeType: 'image/png', buffer: proofPng() });
    await page.getByRole('link', { name: 'Revision 1' }).waitFor();
    await page.getByRole('button', { name: 'Approve revision 1' }).click();
    await page.getByText('Not ready to release').waitFor({ state: 'detached' });
    await expect(page.getByText(/^Approved \w{3} \d|^Approved \d/).count()).resolves.toBe(1);
    await screenshot(page, 'orders-gates-done');

    // 4. release: 300 + 5 % = 315 pieces in trays of 100 → 100, 100, 100, 15
    await page.getByLabel('Pieces per tray').fill('100');
    await expect(page.getByText('4 trays: 3 × 100 + 1 × 15').count()).resolves.toBe(1);
    await page.getByRole('button', { name: /^Release order/ }).click();
    await page.getByRole('heading', { name: 'Travellers' }).waitFor();
    await screenshot(page, 'orders-released');

    // 5. the travellers PDF
    const downloadPromise = page.waitForEvent('download');
    await page.getByRole('link', { name: /Print all travellers \(5\)/ }).click();
    const download = await downloadPromise;
    const file = path.join(dir, 'travellers.pdf');
    await download.saveAs(file);
    const pdf = fs.readFileSync(file);
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    expect(execFileSync('pdfinfo', [file]).toString()).toMatch(/Pages:\s+5\b/);

    // the first page is the mould traveller, the second the first tray: decode it independently
    const order = await (await page.request.get(`${base()}/api/orders/${orderId}`)).json();
    expect(order.trays.map((t: { quantity: number }) => t.quantity)).toEqual([100, 100, 100, 15]);
    execFileSync('pdftoppm', ['-r', '200', '-gray', '-png', '-singlefile', '-f', '2', '-l', '2', file, path.join(dir, 'page2')]);
    const png = PNG.sync.read(fs.readFileSync(path.join(dir, 'page2.png')));
    const qr = jsQR(new Uint8ClampedArray(png.data.buffer, png.data.byteOffset, png.data.length), png.width, png.height);
    expect(qr?.data).toBe(order.trays[0].code);
    expect(qr!.version).toBeLessThanOrEqual(4);
    await context.close();
  });
});
