import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser, screenshot, signInAs, DESKTOP, TABLET } from '../support/browser';
import { DEMO_PEOPLE, DEMO_PASSWORD } from '../../server/seed/demo-people';
import { roleHome } from '../../src/config/paths';
import { ROLES } from '@shared/domain/vocabulary';

const base = () => process.env.TRAYCE_E2E_URL!;
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => browser?.close());

describe('each demo role signs in and lands on its home', () => {
  for (const role of ROLES) {
    it(`${role}`, async () => {
      const person = DEMO_PEOPLE.find((p) => p.role === role)!;
      const context = await browser.newContext({ viewport: role === 'operator' ? TABLET : DESKTOP });
      const page = await signInAs(context, base(), person.email, DEMO_PASSWORD);
      // a home may open on its first tab (reports open on lead time)
      await page.waitForURL((url) => url.pathname.startsWith(roleHome[role]));
      await page.waitForLoadState('networkidle');
      expect(new URL(page.url()).pathname.startsWith(roleHome[role])).toBe(true);
      await expect(
        page
          .getByRole('alert')
          .filter({ hasText: /went wrong|could not be shown/i })
          .count(),
      ).resolves.toBe(0);
      await screenshot(page, `home-${role}`);
      await context.close();
    });
  }

  it('the demo leaves no account that opens with the documented default admin password', async () => {
    // README: admin@trayce.local / trayce-admin is the first admin of a non-demo start
    const res = await fetch(`${base()}/api/auth/login`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'admin@trayce.local', password: 'trayce-admin' }),
    });
    expect(res.status).toBe(401);
  });

  it('shows a wrong password as a readable error and stays on sign-in', async () => {
    const context = await browser.newContext({ viewport: DESKTOP });
    const page = await context.newPage();
    await page.goto(`${base()}/sign-in`);
    await page.getByLabel('E-mail').fill('planner@tallowmere.test');
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page.getByRole('alert').first().textContent()).resolves.toMatch(/not right/);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await context.close();
  });

  it('sends a visitor without a session to sign-in, and shows a 404 page inside the app', async () => {
    const context = await browser.newContext({ viewport: DESKTOP });
    const page = await context.newPage();
    await page.goto(`${base()}/admin/users`);
    await page.waitForURL(/\/sign-in\?next=/);
    await page.getByLabel('E-mail').fill('admin@tallowmere.test');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/admin/users');
    await page.goto(`${base()}/no/such/page`);
    await page.getByRole('alert').filter({ hasText: 'Not found' }).waitFor();
    await screenshot(page, 'not-found');
    await context.close();
  });
});
