import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import crypto from 'node:crypto';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, screenshot, signInAs, DESKTOP, WALL } from '../support/browser';
import { startServer, type ServerProcess } from '../support/server-process';
import { DEMO_PASSWORD } from '../../server/seed/demo-people';
import type { WipResponse } from '@shared/schemas/reports';
import type { StationQueue } from '@shared/schemas/scans';

// The floor wall in Chromium at 1920 x 1080: paired as a wall display, it shows a tray's move
// from waiting to in process within 2 s of the scan being posted through the API, and it picks
// the stream up again by itself after the server restarts.

const base = () => process.env.TRAYCE_E2E_URL!;
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => browser?.close());

/** A signed-in API client (cookie jar of one). */
async function client(url: string, email: string) {
  const login = await fetch(`${url}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  expect(login.status).toBe(200);
  const cookie = login.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
  const call = async <T>(method: string, path: string, body?: unknown): Promise<{ status: number; body: T }> => {
    const res = await fetch(`${url}/api${path}`, {
      method,
      headers: { cookie, 'content-type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    const text = await res.text();
    return { status: res.status, body: (text ? JSON.parse(text) : undefined) as T };
  };
  return call;
}

/** Pairs a new wall display in a fresh browser context and opens the wall. */
async function openPairedWall(url: string): Promise<Page> {
  const admin = await client(url, 'admin@tallowmere.test');
  const created = await admin<{ pairingCode: string }>('POST', '/devices', { name: `Wall ${crypto.randomUUID().slice(0, 6)}`, stationId: null });
  expect(created.status).toBe(201);
  const context = await browser.newContext({ viewport: WALL });
  const page = await context.newPage();
  await page.goto(`${url}/wall`);
  await page.getByLabel('Pairing code').fill(created.body.pairingCode);
  await page.getByRole('button', { name: 'Pair this screen' }).click();
  await page.getByRole('heading', { name: 'Floor now' }).waitFor();
  await page.getByTestId('stream-status').filter({ hasText: 'Live' }).waitFor();
  return page;
}

/** A tray that may start now at a station, found through the API. */
async function startableTray(url: string) {
  const sup = await client(url, 'supervisor@tallowmere.test');
  const wip = (await sup<WipResponse>('GET', '/wip')).body;
  const stations = (await sup<{ id: string; kind: string; code: string }[]>('GET', '/stations')).body;
  for (const kind of wip.kinds.filter((k) => k.waiting.trays > 0 && k.stationKind !== 'cure').sort((a, b) => b.waiting.trays - a.waiting.trays)) {
    for (const st of stations.filter((s) => s.kind === kind.stationKind)) {
      const queue = (await sup<StationQueue>('GET', `/stations/${st.id}/queue`)).body;
      const card = queue.trays.find(
        (c) =>
          c.tray.kind === 'tray' &&
          c.state.phase === 'waiting' &&
          c.routing.find((r) => r.seq === c.state.stepSeq)?.stationKind === kind.stationKind &&
          !c.state.onHold &&
          c.mouldReady &&
          (!c.state.cureReadyAt || Date.parse(c.state.cureReadyAt) < Date.now()),
      );
      if (card) return { sup, kind: kind.stationKind, station: st, tray: card.tray };
    }
  }
  throw new Error('the demo floor has no tray that can start now');
}

async function tileCount(page: Page, kind: string, label: 'waiting' | 'in-process') {
  return Number((await page.locator(`section[data-kind="${kind}"] [data-testid="count-${label}"]`).textContent())?.replace(/[^\d]/g, ''));
}

async function startAndWatch(url: string, page: Page) {
  const { sup, kind, station, tray } = await startableTray(url);
  const waiting = await tileCount(page, kind, 'waiting');
  const inProcess = await tileCount(page, kind, 'in-process');
  const sent = Date.now();
  const res = await sup<{ results: { status: string; message?: string }[] }>('POST', '/scans', {
    events: [{ id: crypto.randomUUID(), code: tray.number, stationId: station.id, type: 'start', occurredAt: new Date().toISOString() }],
  });
  expect(res.status).toBe(200);
  expect(res.body.results[0].status, res.body.results[0].message).toBe('accepted');
  await page.waitForFunction(
    ([k, w, p]) => {
      const n = (id: string) => Number(document.querySelector(`section[data-kind="${k}"] [data-testid="count-${id}"]`)?.textContent?.replace(/[^\d]/g, ''));
      return n('waiting') === w - 1 && n('in-process') === p + 1;
    },
    [kind, waiting, inProcess] as const,
    { timeout: 2000, polling: 50 },
  );
  return { kind, ms: Date.now() - sent };
}

describe('the floor wall', () => {
  it('pairs as a wall display and updates a tile within 2 s of a scan posted through the API', async () => {
    const page = await openPairedWall(base());
    await screenshot(page, 'wall-1920x1080-dark');
    const { ms } = await startAndWatch(base(), page);
    expect(ms).toBeLessThan(2000);
    await page.getByRole('button', { name: 'Light screen' }).click();
    await page.getByRole('button', { name: 'Dark screen' }).waitFor();
    await screenshot(page, 'wall-1920x1080-light');
    // nothing rests on colour alone: the states are written out
    await expect(page.getByText('Waiting').first().isVisible()).resolves.toBe(true);
    await expect(page.getByText(/Needs a supervisor/).isVisible()).resolves.toBe(true);
    await page.context().close();
  });

  it('at 1920 x 1080 no text is under 28 px, the bottleneck tile names its station, and "+N more" opens the whole list on the floor page', async () => {
    const page = await openPairedWall(base());
    await page.getByTestId('stream-status').filter({ hasText: 'Live' }).waitFor();
    // every element that draws text of its own, measured as the browser lays it out
    const sizes = await page.evaluate(() => {
      const out: { text: string; px: number }[] = [];
      const walker = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT);
      for (let n = walker.nextNode(); n; n = walker.nextNode()) {
        const text = n.textContent?.trim() ?? '';
        const el = n.parentElement;
        if (!text || !el) continue;
        const r = el.getBoundingClientRect();
        if (r.width === 0 || r.height === 0 || r.bottom < 0 || r.top > innerHeight) continue;
        out.push({ text: text.slice(0, 30), px: parseFloat(getComputedStyle(el).fontSize) });
      }
      return out;
    });
    expect(sizes.length).toBeGreaterThan(20);
    const small = sizes.filter((x) => x.px < 28);
    expect(small, JSON.stringify(small.slice(0, 10))).toEqual([]);
    // the bottleneck tile: its station's name in view beside the badge
    const hot = page.locator('section[data-kind]').filter({ has: page.getByTestId('bottleneck-badge') });
    expect(await hot.count(), 'the demo floor has a bottleneck').toBe(1);
    {
      const kind = await hot.getAttribute('data-kind');
      const name = hot.getByTestId('tile-name');
      const box = (await name.boundingBox())!;
      expect(box.height, `${kind}: the name is drawn`).toBeGreaterThan(20);
      expect((await name.innerText()).trim().length).toBeGreaterThan(2);
      const note = await page.getByTestId('bottleneck-note').innerText();
      expect(note).toContain((await name.innerText()).trim());
    }
    // every tile is whole on the screen, and nothing on a tile spills out of it (a long name wraps inside)
    const spills = await page.evaluate(() =>
      [...document.querySelectorAll('section[data-kind]')].flatMap((tile) => {
        const box = tile.getBoundingClientRect();
        const out: string[] = [];
        if (box.bottom > innerHeight + 0.5 || box.right > innerWidth + 0.5) out.push(`${tile.getAttribute('data-kind')} ends off the screen`);
        for (const child of tile.querySelectorAll('*')) {
          const r = child.getBoundingClientRect();
          if (r.width === 0 || r.height === 0 || child.closest('.sr-only')) continue;
          if (r.bottom > box.bottom + 0.5 || r.right > box.right + 0.5)
            out.push(`${tile.getAttribute('data-kind')}: "${child.textContent?.slice(0, 20)}" spills out`);
        }
        return out;
      }),
    );
    expect(spills).toEqual([]);
    // countdowns read as durations, not clock times
    for (const left of await page.getByTestId('cure-left').allInnerTexts()) expect(left).toMatch(/^(Ready|\d+ h \d+ min left|\d+ min \d+ s left)$/);
    await screenshot(page, 'wall-1920x1080-sizes');
    const more = page.getByTestId('more');
    expect(await more.count(), 'the demo floor has more to decide than the wall lists').toBeGreaterThan(0);
    {
      const first = more.first();
      const href = (await first.getAttribute('href'))!;
      expect(href).toMatch(/^\/floor#(needs-supervisor|at-risk)$/);
    }
    await page.context().close();
  });

  it('shows the same picture on the supervisor’s floor page', async () => {
    const context = await browser.newContext({ viewport: DESKTOP });
    const page = await signInAs(context, base(), 'supervisor@tallowmere.test', DEMO_PASSWORD);
    await page.goto(`${base()}/floor`);
    await page.getByText('Live: updates as trays are scanned').waitFor();
    await screenshot(page, 'floor-supervisor');
    await context.close();
  });

  it('reconnects by itself after the server restarts', async () => {
    let server: ServerProcess | null = null;
    try {
      server = await startServer({ seed: 'demo' });
      const page = await openPairedWall(server.url);
      await server.restart();
      await page.getByTestId('stream-status').filter({ hasText: 'Live' }).waitFor({ timeout: 30_000 });
      const { ms } = await startAndWatch(server.url, page);
      expect(ms).toBeLessThan(2000);
      await page.context().close();
    } finally {
      await server?.stop();
    }
  });
});
