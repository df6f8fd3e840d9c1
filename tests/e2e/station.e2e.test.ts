// The station tablet in Chromium at tablet size: pairing, badge sign-in, offline scanning with a
// keyboard-wedge hand scanner, the outbox delivering every scan exactly once (also across a server
// restart), and the Chinese screen.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import path from 'node:path';
import fs from 'node:fs';
import crypto from 'node:crypto';
import { eq, inArray } from 'drizzle-orm';
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { launchBrowser, PORTRAIT, screenshot, TABLET } from '../support/browser';
import { startServer, type ServerProcess } from '../support/server-process';
import { PROJECT_ROOT } from '../support/paths';
import { insertFloorOrder, type FloorTray } from '../support/scan-fixtures';
import { openDb, type Db } from '../../server/db/client';
import { loadOrCreateKey } from '../../server/lib/keys';
import { scanEvents } from '../../server/db/schema/scans';
import { trayStates } from '../../server/db/schema/trays';
import { users } from '../../server/db/schema/users';
import { stationsRepository } from '../../server/repositories/stations.repository';
import { devicesService } from '../../server/services/devices.service';
import { usersService } from '../../server/services/users.service';
import type { AppDeps } from '../../server/app-deps';
import { en } from '../../src/features/station/i18n/en';
import { zhCN } from '../../src/features/station/i18n/zh-CN';

// One server of our own (base seed, our people and travellers), in a folder of its own so other
// test runs that clear the shared e2e folder cannot pull it away; it is also the one restarted.
let browser: Browser;
let server: ServerProcess;
let s: ReturnType<typeof serverDb>;
beforeAll(async () => {
  browser = await launchBrowser();
  server = await startServer({ seed: 'none', dataDir: path.join(PROJECT_ROOT, '.tmp', 'station-e2e', crypto.randomUUID()) });
  s = serverDb(server.dataDir);
  await usersService.create(
    s.deps,
    { name: 'Chen Xiuying', email: 'chen@e2e.test', role: 'operator', password: 'operator-password-1', badge: 'B-201', pin: '1357' },
    null,
  );
  await usersService.create(
    s.deps,
    { name: 'Huang Yimin', email: 'huang@e2e.test', role: 'operator', password: 'operator-password-2', badge: 'B-202', pin: '2580' },
    null,
  );
  await usersService.create(
    s.deps,
    { name: 'Dario Okonjo', email: 'dario@e2e.test', role: 'supervisor', password: 'supervisor-password-1', badge: 'S-100', pin: '2468' },
    null,
  );
});
afterAll(async () => {
  await browser?.close();
  s?.close();
  await server?.stop();
  if (server) fs.rmSync(server.dataDir, { recursive: true, force: true });
});

/** A second connection to a running server's database (SQLite in WAL mode takes it). */
function serverDb(dataDir: string) {
  const db = openDb(path.join(dataDir, 'trayce.db'));
  const deps = { db, now: () => Date.now(), keys: { traveller: loadOrCreateKey(dataDir, 'traveller'), session: new Uint8Array(32) } } as unknown as AppDeps;
  return {
    db,
    deps,
    station: (code: string) => stationsRepository.byCode(db, code)!,
    pairingCode(stationCode: string, locale: 'en' | 'zh-CN' = 'en') {
      const s = stationsRepository.byCode(db, stationCode)!;
      return devicesService.create(deps, { name: `E2E tablet ${stationCode} ${Date.now() % 100000}`, stationId: s.id, locale, idleMinutes: 30 }, null)
        .pairingCode;
    },
    close: () => db.$client.close(),
  };
}

function eventsOf(db: Db, trays: FloorTray[]) {
  return db
    .select()
    .from(scanEvents)
    .where(
      inArray(
        scanEvents.trayId,
        trays.map((t) => t.id),
      ),
    )
    .all();
}

async function pairAndSignIn(
  context: BrowserContext,
  baseUrl: string,
  code: string,
  badge: string,
  pin: string,
  labels = { pair: 'Pairing code', pairButton: 'Pair tablet', paired: 'Paired as', badge: 'Badge', confirm: 'Confirm', pin: 'PIN', signIn: 'Sign in' },
): Promise<Page> {
  const page = await context.newPage();
  await page.goto(`${baseUrl}/pair`);
  await page.getByLabel(labels.pair).fill(code);
  await page.getByRole('button', { name: labels.pairButton, exact: true }).click();
  await page.getByText(labels.paired).waitFor();
  await page.goto(`${baseUrl}/station`);
  await page.getByLabel(labels.badge, { exact: true }).fill(badge);
  await page.getByRole('button', { name: labels.confirm }).click();
  await page.getByRole('textbox', { name: labels.pin }).fill(pin);
  await page.getByRole('button', { name: labels.signIn, exact: true }).click();
  await page.getByTestId('station-name').waitFor();
  return page;
}

/**
 * Sends keys as a hand scanner in keyboard-wedge mode does: the whole code in one burst, then
 * Enter, with no field focused. The key events are made inside the page in one go, so a busy test
 * machine cannot stretch the gaps between keys the way typing from here key by key can (a real
 * scanner's keys arrive a few milliseconds apart whatever else runs).
 */
async function wedgeScan(page: Page, text: string) {
  await page.evaluate((code) => {
    (document.activeElement as HTMLElement | null)?.blur();
    for (const key of [...code, 'Enter']) {
      document.body.dispatchEvent(new KeyboardEvent('keydown', { key, bubbles: true, cancelable: true }));
      document.body.dispatchEvent(new KeyboardEvent('keyup', { key, bubbles: true, cancelable: true }));
    }
  }, text);
}

/** Sets the language saved with a person's account (what the tablet speaks after sign-in). */
function setLocale(db: Db, badge: string, locale: 'en' | 'zh-CN') {
  db.update(users).set({ locale }).where(eq(users.badge, badge)).run();
}

async function startAndFinish(page: Page, tray: FloorTray) {
  await wedgeScan(page, tray.code);
  await page.getByRole('heading', { name: tray.number }).waitFor();
  await page.getByRole('button', { name: 'Start', exact: true }).click();
  await page.getByTestId('feedback').getByText(`Started: ${tray.number}`).waitFor();
  await page.getByRole('button', { name: 'Finish', exact: true }).click();
  await page.getByRole('button', { name: 'Confirm' }).click();
  await page.getByTestId('feedback').getByText(`Finished: ${tray.number}`).waitFor();
}

async function pendingCount(page: Page): Promise<number> {
  return Number(await page.getByTestId('net-status').getAttribute('data-pending'));
}

describe('station tablet', () => {
  it('offline: 50 trays scanned through a station with a hand scanner reach the server exactly once', async () => {
    const base = server.url;
    // Travellers waiting at post fitting, released six days ago so they head the station's list.
    const { trays } = insertFloorOrder(s.deps, { trays: 50, quantity: 40, releasedAt: Date.now() - 6 * 24 * 3600_000, stepSeq: 3 });
    const context = await browser.newContext({ viewport: TABLET });
    const page = await pairAndSignIn(context, base, s.pairingCode('PST-1'), 'B-201', '1357');
    // The app shell is cached by the service worker and the station's travellers are on the tablet.
    await page.evaluate(() => navigator.serviceWorker.ready.then(() => true));
    await page.getByTestId('queue-row').filter({ hasText: trays[49].number }).waitFor();
    await screenshot(page, 'station-online');

    await context.setOffline(true);
    await page.getByTestId('net-status').and(page.locator('[data-online="no"]')).waitFor();
    for (const tray of trays) await startAndFinish(page, tray);
    expect(await pendingCount(page)).toBe(100);
    await expect(page.getByTestId('net-status').textContent()).resolves.toMatch(/Offline.*100 scans waiting/);
    expect(eventsOf(s.db, trays)).toHaveLength(0);
    await screenshot(page, 'station-offline-100-waiting');

    // Closing and reopening the app offline keeps every scan: the outbox is on the tablet.
    await page.reload();
    // What counts is that the outbox kept every scan. Whether the reopened page calls itself
    // offline depends on how the browser emulates offline for a page its service worker serves,
    // which differs between Chromium releases, so the flag is not asserted here.
    await page.getByTestId('net-status').and(page.locator('[data-pending="100"]')).waitFor();

    await context.setOffline(false);
    await page.getByTestId('net-status').and(page.locator('[data-pending="0"]')).waitFor({ timeout: 60_000 });
    const rows = eventsOf(s.db, trays);
    expect(rows).toHaveLength(100);
    expect(new Set(rows.map((r) => r.id)).size).toBe(100);
    for (const tray of trays)
      expect(
        rows
          .filter((r) => r.trayId === tray.id)
          .map((r) => r.type)
          .sort(),
      ).toEqual(['finish', 'start']);
    const states = s.db
      .select()
      .from(trayStates)
      .where(
        inArray(
          trayStates.trayId,
          trays.map((t) => t.id),
        ),
      )
      .all();
    expect(states.every((st) => st.phase === 'waiting' && st.stepSeq === 4 && st.quantity === 40)).toBe(true);
    await screenshot(page, 'station-back-online');
    await context.close();
  });

  it('the server restarts while the tablet syncs: every scan ends up on the server exactly once', async () => {
    const { trays } = insertFloorOrder(s.deps, { trays: 30, quantity: 25, releasedAt: Date.now() - 24 * 3600_000, stepSeq: 2 });
    const context = await browser.newContext({ viewport: TABLET });
    const page = await pairAndSignIn(context, server.url, s.pairingCode('TRM-1'), 'B-202', '2580');
    await page.getByTestId('queue-row').filter({ hasText: trays[29].number }).waitFor();
    await context.setOffline(true);
    await page.getByTestId('net-status').and(page.locator('[data-online="no"]')).waitFor();
    for (const tray of trays) await startAndFinish(page, tray);
    expect(await pendingCount(page)).toBe(60);

    // The first batch reaches the server and is stored, then the server goes down before the
    // tablet hears the answer; the tablet must send again once the server is back.
    let restarted = false;
    await page.route('**/api/scans', async (route) => {
      if (restarted) return route.continue();
      restarted = true;
      await route.fetch();
      await server.restart();
      await route.abort('connectionreset');
    });
    await context.setOffline(false);
    await page.getByTestId('net-status').and(page.locator('[data-pending="0"]')).waitFor({ timeout: 90_000 });
    expect(restarted).toBe(true);
    const rows = eventsOf(s.db, trays);
    expect(rows).toHaveLength(60);
    expect(new Set(rows.map((r) => r.id)).size).toBe(60);
    await context.close();
  });

  it('a wrong-station scan goes through with a supervisor’s badge, PIN and reason, and is recorded', async () => {
    const {
      trays: [tray],
    } = insertFloorOrder(s.deps, { trays: 1, quantity: 30, releasedAt: Date.now() - 24 * 3600_000, stepSeq: 3 });
    const context = await browser.newContext({ viewport: TABLET });
    const page = await pairAndSignIn(context, server.url, s.pairingCode('TRM-1'), 'B-201', '1357');
    await wedgeScan(page, tray.code);
    await page.getByRole('heading', { name: tray.number }).waitFor();
    await page.getByRole('button', { name: 'Start', exact: true }).click();
    await page.getByTestId('feedback').getByText('Wrong station').waitFor();
    await page.getByRole('button', { name: 'Supervisor override' }).click();
    await page.getByLabel('Supervisor badge').fill('S-100');
    await page.getByRole('textbox', { name: 'Supervisor PIN' }).fill('2468');
    await page.getByLabel('Reason', { exact: true }).fill('Posts fitted on the trimming bench today');
    await screenshot(page, 'station-override');
    await page.getByRole('button', { name: 'Approve' }).click();
    await page.getByTestId('feedback').getByText(`Started: ${tray.number}`).waitFor();
    await page.getByTestId('net-status').and(page.locator('[data-pending="0"]')).waitFor();
    const [row] = eventsOf(s.db, [tray]);
    expect(row.overrideId).toBeTruthy();
    const audit = s.db.$client.prepare("select user_id as userId, detail from audit_log where action = 'scan.override' and entity_id = ?").get(tray.id) as {
      userId: string;
      detail: string;
    };
    expect(JSON.parse(audit.detail)).toMatchObject({ overridden: ['wrong_station'], reason: 'Posts fitted on the trimming bench today' });
    await context.close();
  });

  it('in Chinese, the station screen shows no English words of ours', async () => {
    const base = server.url;
    const { trays } = insertFloorOrder(s.deps, { trays: 3, quantity: 60, releasedAt: Date.now() - 5 * 24 * 3600_000, stepSeq: 4 });
    // a person whose account says Chinese, on a Chinese tablet
    setLocale(s.db, 'B-202', 'zh-CN');
    const context = await browser.newContext({ viewport: TABLET, locale: 'zh-CN' });
    const page = await pairAndSignIn(context, base, s.pairingCode('FIL-2', 'zh-CN'), 'B-202', '2580', {
      // before pairing the screen follows the browser's language (zh-CN here)
      pair: '配对码',
      pairButton: '配对',
      paired: '已配对为',
      badge: '工牌',
      confirm: '确认',
      pin: '密码',
      signIn: '登录',
    });
    await page.getByTestId('queue-row').filter({ hasText: trays[0].number }).waitFor();
    await wedgeScan(page, trays[0].code);
    await page.getByRole('heading', { name: trays[0].number }).waitFor();
    // a refusal, in Chinese: finishing a tray that was never started (said before any counting)
    await page.getByRole('button', { name: '完成', exact: true }).click();
    await page.getByTestId('feedback').getByText('尚未开始').waitFor();
    // and the counting panel of a tray that is in process
    await page.getByRole('button', { name: '开始', exact: true }).click();
    await page.getByTestId('feedback').getByText('已开始').waitFor();
    await page.getByRole('button', { name: '完成', exact: true }).click();
    await page.getByRole('heading', { name: '完成：清点数量' }).waitFor();
    await screenshot(page, 'station-chinese');

    // Everything on screen, minus the factory's own data (names, numbers, titles, station texts).
    const queue = await page.evaluate(async (id) => (await fetch(`/api/stations/${id}/queue`)).json(), s.station('FIL-2').id);
    // the station's own texts show in Chinese (seeded with the base stations)
    expect(await page.getByTestId('station-name').innerText()).toBe(queue.station.nameZh);
    await page.getByText(queue.station.safetyNotesZh).waitFor();
    const data: string[] = [
      queue.station.nameZh,
      queue.station.instructionsZh,
      queue.station.safetyNotesZh,
      await page.getByTestId('operator-name').innerText(),
    ];
    for (const c of queue.trays) {
      data.push(c.tray.number);
      if (c.order)
        data.push(c.order.number, c.order.title, c.order.customer, ...c.order.colours.flatMap((x: { name: string; ref?: string }) => [x.name, x.ref ?? '']));
    }
    let text = await page.locator('body').innerText();
    for (const d of data.filter(Boolean).sort((a, b) => b.length - a.length)) text = text.split(d).join(' ');
    const words = (text.match(/[A-Za-z]{2,}/g) ?? []).filter((w) => w !== 'English');
    expect(words, text).toEqual([]);
    // and none of the English strings of the tablet (checked against the English resources)
    const english: string[] = [];
    const walk = (o: object) => Object.values(o).forEach((v) => (typeof v === 'string' ? english.push(v) : walk(v)));
    walk(en);
    for (const phrase of english.filter((e) => e.length > 4 && !e.includes('{{') && e !== 'English' && e !== '简体中文'))
      expect(text.includes(phrase), phrase).toBe(false);
    await context.close();
  });

  for (const size of [TABLET, PORTRAIT]) {
    for (const lang of ['en', 'zh-CN'] as const) {
      it(`at ${size.width} x ${size.height} in ${lang}: every scan's result and the tray's actions stay in view; a held tray is listed last, as held`, async () => {
        const w = lang === 'en' ? en : zhCN;
        const name = (s: string) => new RegExp(`^${s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}$`);
        // three trays waiting for post fitting; the oldest is put on hold, so by age it would head the list
        const { trays } = insertFloorOrder(s.deps, { trays: 3, quantity: 40, releasedAt: Date.now() - 9 * 24 * 3600_000, stepSeq: 3 });
        const [held, first, second] = trays;
        s.db.update(trayStates).set({ onHold: true, holdReason: 'hold_customer' }).where(eq(trayStates.trayId, held.id)).run();
        // and one for trimming, scanned here by mistake
        const {
          trays: [elsewhere],
        } = insertFloorOrder(s.deps, { trays: 1, quantity: 10, releasedAt: Date.now() - 3600_000, stepSeq: 2 });

        // the person starts in English (an earlier run may have chosen Chinese for them)
        setLocale(s.db, 'B-202', 'en');
        const context = await browser.newContext({ viewport: size });
        const page = await context.newPage();
        await page.goto(`${server.url}/pair`);
        await page.getByLabel('Pairing code').fill(s.pairingCode('PST-1', 'en'));
        await page.getByRole('button', { name: 'Pair tablet' }).click();
        await page.getByText('Paired as').waitFor();
        await page.goto(`${server.url}/station`);
        // the badge screen offers the other language; the tablet itself is set to English
        if (lang === 'zh-CN') await page.getByRole('button', { name: /简体中文/ }).click();
        await page.getByLabel(w.signIn.badge, { exact: true }).fill('B-202');
        await page.getByRole('button', { name: w.action.confirm }).click();
        await page.getByRole('textbox', { name: w.signIn.pin }).fill('2580');
        if (lang === 'zh-CN') await screenshot(page, `station-pin-${size.width}x${size.height}-${lang}`);
        await page.getByRole('button', { name: w.signIn.submit, exact: true }).click();
        await page.getByTestId('station-name').waitFor();
        expect(await page.getByTestId('station-name').innerText()).toBe(lang === 'en' ? 'Post fitting' : '焊针');

        // the held tray: in the list, marked held, after every tray that is ready
        const rows = page.getByTestId('queue-row');
        await rows.filter({ hasText: second.number }).waitFor();
        const waiting = page.locator('section[aria-labelledby="list-waiting"]').getByTestId('queue-row');
        const numbers = (await waiting.locator('span.font-mono').allInnerTexts()).map((x) => x.trim());
        expect(numbers.indexOf(held.number)).toBe(numbers.length - 1);
        const heldRow = waiting.filter({ hasText: held.number });
        expect(await heldRow.getAttribute('data-held')).toBe('yes');
        expect(await heldRow.innerText()).toContain(lang === 'en' ? 'on hold' : '已暂停');
        expect(await heldRow.innerText()).not.toContain(w.lists.readyNow);
        for (const n of [first.number, second.number]) expect(await waiting.filter({ hasText: n }).getAttribute('data-held')).toBe('no');

        // header: the station name whole, the language and sign-out controls each on one line
        for (const label of [lang === 'en' ? w.app.chinese : w.app.english, w.top.signOut]) {
          const box = (await page
            .getByRole('button', { name: new RegExp(label) })
            .first()
            .boundingBox())!;
          expect(box.height, `${label} on one line`).toBeLessThan(60);
        }
        const nameBox = await page.getByTestId('station-name').evaluate((el) => ({ scroll: el.scrollWidth, client: el.clientWidth }));
        expect(nameBox.scroll).toBeLessThanOrEqual(nameBox.client);

        const seen = async (what: string, l: Locator) => {
          await l.first().waitFor();
          const box = (await l.first().boundingBox())!;
          expect(box, what).toBeTruthy();
          expect(box.y, `${what}: top in view`).toBeGreaterThanOrEqual(0);
          expect(box.y + box.height, `${what}: bottom in view (${size.height})`).toBeLessThanOrEqual(size.height);
          expect(box.x + box.width, `${what}: right edge in view`).toBeLessThanOrEqual(size.width);
        };
        const feedback = (text: string) => page.getByTestId('feedback').filter({ hasText: text });
        const trayActions = async (number: string) => {
          await seen('tray number', page.getByTestId('bar-tray-number').filter({ hasText: number }));
          for (const b of [w.action.start, w.action.finish, w.action.hold]) await seen(b, page.getByRole('button', { name: name(b) }));
        };
        // the result sits in a live region, so a screen reader says it
        const announced = async (text: string) => {
          const region = await feedback(text).evaluate((el) => el.closest('[aria-live]')?.getAttribute('aria-live') ?? null);
          expect(region, `${text} in an aria-live region`).toMatch(/polite|assertive/);
        };

        // opens a tray by its typed number (the scanner's own path is covered above)
        const open = async (tray: FloorTray) => {
          const close = page.getByRole('button', { name: w.card.close, exact: true });
          if (await close.count()) await close.click();
          await page.getByLabel(w.scan.type).fill(tray.number);
          await page.getByRole('button', { name: w.scan.typeSubmit }).click();
        };
        // the whole loop on the first tray, from the top of the list and after the screen was scrolled
        await open(first);
        await page.getByRole('heading', { name: first.number }).waitFor();
        await trayActions(first.number);
        await page.getByRole('button', { name: name(w.action.start) }).click();
        const started = `${w.feedback.started}: ${first.number}`;
        await seen('started', feedback(started));
        await announced(started);
        await trayActions(first.number);
        await page.locator('main').evaluate((el) => el.scrollTo({ top: el.scrollHeight }));
        await page.getByRole('button', { name: name(w.action.finish) }).click();
        await page.getByRole('heading', { name: w.finish.title }).waitFor();
        await seen('tray number while counting', page.getByTestId('bar-tray-number').filter({ hasText: first.number }));
        await seen('confirm', page.getByRole('button', { name: name(w.action.confirm) }));
        await seen('counting panel', page.getByRole('heading', { name: w.finish.title }));
        await screenshot(page, `station-finish-${size.width}x${size.height}-${lang}`);
        await page.getByRole('button', { name: name(w.action.confirm) }).click();
        const finished = `${w.feedback.finished}: ${first.number}`;
        await seen('finished', feedback(finished));
        await announced(finished);
        await screenshot(page, `station-finished-${size.width}x${size.height}-${lang}`);

        // a hold, then a tray scanned at the wrong station: refused, in view, said at once
        await open(second);
        await page.getByRole('heading', { name: second.number }).waitFor();
        await page.getByRole('button', { name: name(w.action.hold) }).click();
        await seen('hold confirm', page.getByRole('button', { name: name(w.hold.confirm) }));
        await page.getByRole('button', { name: name(w.hold.confirm) }).click();
        await seen('held', feedback(`${w.feedback.held}: ${second.number}`));
        // a held tray offers Release where Hold was
        await seen('tray number', page.getByTestId('bar-tray-number').filter({ hasText: second.number }));
        for (const b of [w.action.start, w.action.finish, w.action.release]) await seen(b, page.getByRole('button', { name: name(b) }));
        await open(elsewhere);
        await page.getByRole('heading', { name: elsewhere.number }).waitFor();
        await page.getByRole('button', { name: name(w.action.start) }).click();
        const refusal = page.getByTestId('feedback').and(page.locator('[data-kind="refused"]'));
        await seen('wrong-station refusal', refusal);
        expect(await refusal.evaluate((el) => el.closest('[aria-live]')?.getAttribute('aria-live'))).toBe('assertive');
        await seen('override', page.getByRole('button', { name: name(w.action.override) }));
        await trayActions(elsewhere.number);
        await screenshot(page, `station-refused-${size.width}x${size.height}-${lang}`);

        // the person's language is remembered for them: signed out, the badge screen is the tablet's
        // English again, and the same person signing in gets their language back
        await page.getByRole('button', { name: name(w.top.signOut) }).click();
        await page.getByLabel('Badge', { exact: true }).fill('B-202');
        await page.getByRole('button', { name: 'Confirm' }).click();
        await page.getByRole('textbox', { name: 'PIN' }).fill('2580');
        await page.getByRole('button', { name: 'Sign in', exact: true }).click();
        await page.getByRole('button', { name: name(w.top.signOut) }).waitFor();
        await context.close();
      });
    }
  }
});
