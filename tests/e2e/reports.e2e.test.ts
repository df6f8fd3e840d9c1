import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser, screenshot, signInAs, DESKTOP } from '../support/browser';
import { DEMO_PASSWORD } from '../../server/seed/demo-people';

// A manager opens every report on the demo factory's history, sees its chart and table and the
// percentile method named, and downloads its CSV. Screens of load planning and the calendar too.

const base = () => process.env.TRAYCE_E2E_URL!;
let browser: Browser;
let context: BrowserContext;
let page: Page;

beforeAll(async () => {
  browser = await launchBrowser();
  context = await browser.newContext({ viewport: DESKTOP, acceptDownloads: true });
  page = await signInAs(context, base(), 'manager@tallowmere.test', DEMO_PASSWORD);
});
afterAll(async () => {
  await context?.close();
  await browser?.close();
});

// `percentiles`: the report shows percentiles, so it names their method (only those do)
const REPORTS = [
  {
    tab: 'Lead time',
    path: 'lead-time',
    table: 'Lead time summary',
    header: 'order,customer,title,process,released_at,shipped_at,calendar_hours,working_hours,due_date,on_time',
    percentiles: true,
  },
  { tab: 'Cycle time', path: 'cycle-time', table: 'Cycle time table', header: 'station_kind,process_n,process_p50_min', percentiles: true },
  { tab: 'Flow & throughput', path: 'flow', table: 'Cumulative flow table', header: 'bucket_start,cumulative_released,cumulative_started', percentiles: false },
  { tab: 'On-time delivery', path: 'on-time', table: 'On-time table', header: 'bucket_start,shipped,on_time,on_time_share', percentiles: false },
  { tab: 'Yield & scrap', path: 'yield', table: 'Yield per step table', header: 'section,name,in_qty,first_pass_qty', percentiles: false },
] as const;

describe('reports', () => {
  it("the manager's home is one summary page: WIP, on-time, yield and scrap, late orders, throughput, each linking to its report", async () => {
    await page.goto(`${base()}/`);
    await page.waitForURL((u) => u.pathname === '/reports');
    for (const id of ['summary-wip', 'summary-on-time', 'summary-late', 'summary-yield', 'summary-throughput']) {
      const tile = page.getByTestId(id);
      await tile.waitFor();
      // each tile settles on figures, not on an error
      // (four weeks of yield read week by week: allow a loaded machine its time)
      await page.waitForFunction((sel) => !document.querySelector(`[data-testid="${sel}"] [role="status"]`), id, { polling: 100, timeout: 120_000 });
      await expect(tile.getByRole('alert').count()).resolves.toBe(0);
      await expect(tile.innerText()).resolves.toMatch(/\d/);
    }
    // a 0 % or any share on the on-time tile is a percentage of the four weeks
    await expect(page.getByTestId('summary-on-time').innerText()).resolves.toMatch(/%|No order shipped/);
    await screenshot(page, 'report-summary');
    await page.getByRole('link', { name: 'Open the report' }).first().click();
    await page.waitForURL((u) => u.pathname === '/reports/on-time' && u.searchParams.get('bucket') === 'week');
  });

  for (const r of REPORTS) {
    it(`opens ${r.tab}, shows its chart and table, names the percentile method where it has percentiles and downloads the CSV`, async () => {
      await page.goto(`${base()}/reports`);
      await page.getByRole('navigation', { name: 'Reports' }).getByRole('link', { name: r.tab }).click();
      await page.waitForURL((u) => u.pathname === `/reports/${r.path}`);
      const table = page.getByRole('table', { name: r.table });
      await table.waitFor();
      // the demo history has weeks of scans: the table has rows, and a chart is drawn
      await expect(table.locator('tbody tr').count()).resolves.toBeGreaterThan(0);
      await page.locator('.recharts-surface').first().waitFor();
      await expect(page.getByText(/Hyndman & Fan type 7/).count()).resolves.toBe(r.percentiles ? 1 : 0);
      const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download CSV' }).click()]);
      expect(download.suggestedFilename()).toMatch(new RegExp(`^${r.path}-\\d{4}-\\d{2}-\\d{2}-\\d{4}-\\d{2}-\\d{2}\\.csv$`));
      const file = await download.path();
      const text = fs.readFileSync(file!, 'utf8').replace(/^\uFEFF/, '');
      const lines = text.split('\r\n');
      expect(lines[0].startsWith(r.header)).toBe(true);
      expect(lines.length).toBeGreaterThan(1);
      await screenshot(page, `report-${r.path}`);
    });
  }

  it('narrows a report with the filters, and the CSV link follows them', async () => {
    await page.goto(`${base()}/reports/cycle-time`);
    await page.getByRole('table', { name: 'Cycle time table' }).waitFor();
    await page.getByRole('combobox', { name: 'Process', exact: true }).selectOption('hard_enamel');
    await page.waitForURL((u) => u.searchParams.get('process') === 'hard_enamel');
    await page.locator('a[href*="/api/reports/cycle-time.csv"][href*="process=hard_enamel"]').waitFor();
    await page.getByRole('table', { name: 'Cycle time table' }).waitFor();
  });

  it('shows load planning and the working calendar', async () => {
    await page.goto(`${base()}/loads`);
    await page.getByRole('heading', { name: 'Oven & bath loads' }).waitFor();
    await page.getByRole('heading', { name: 'Waiting for plating' }).waitFor();
    await screenshot(page, 'loads');
    const admin = await signInAs(await browser.newContext({ viewport: DESKTOP }), base(), 'admin@tallowmere.test', DEMO_PASSWORD);
    await admin.goto(`${base()}/admin/calendar`);
    await admin.getByLabel('Factory time zone').waitFor();
    await expect(admin.getByLabel('Factory time zone').inputValue()).resolves.toBe('Asia/Shanghai');
    await screenshot(admin, 'admin-calendar');
    await admin.context().close();
  });
});
