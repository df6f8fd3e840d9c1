import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { PROJECT_ROOT } from './paths';

export const CHROMIUM = process.env.TRAYCE_CHROMIUM ?? '/usr/bin/chromium';
export const SCREENSHOTS = path.join(PROJECT_ROOT, 'test-results', 'screenshots');

export const TABLET = { width: 1024, height: 768 };
/** a tablet held upright */
export const PORTRAIT = { width: 800, height: 1280 };
export const DESKTOP = { width: 1440, height: 900 };
export const PHONE = { width: 390, height: 844 };
export const WALL = { width: 1920, height: 1080 };

/** Debian's Chromium, headless, with the flags this closed network needs. */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM,
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--disable-dev-shm-usage',
    ],
  });
}

export async function screenshot(page: Page, name: string): Promise<string> {
  fs.mkdirSync(SCREENSHOTS, { recursive: true });
  const file = path.join(SCREENSHOTS, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** Signs in through the real sign-in form. */
export async function signInAs(context: BrowserContext, baseUrl: string, email: string, password: string): Promise<Page> {
  const page = await context.newPage();
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
  return page;
}
