// One clock: a fixed instant and a due day read the same on the spec card, the order list and the
// station tablet, in the factory's zone whatever the device's own zone. Expected strings worked
// out by hand: 2026-12-10T02:27Z in Asia/Shanghai (UTC+8 all year, IANA tz database; China has
// kept no daylight saving time since 1991, from memory) is 10:27 on Thursday 10 December 2026.
import { beforeAll, describe, expect, it } from 'vitest';
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { MemoryRouter } from 'react-router';
import type { OrderDetail, OrderListItem } from '@shared/schemas/orders';
import type { TrayCard } from '@shared/schemas/scans';
import type { TrayState } from '@shared/domain/vocabulary';
import { formatInstant, formatDay } from '@shared/domain/time-format';
import { applyLocale } from '@/lib/i18n';
import { factoryDateInDays, factoryLocalToIso, factoryTodayDate, formatAnyDay, setFactoryTimeZone } from './datetime';
import { SpecCard } from '@/features/orders/components/spec-card';
import { OrdersTable } from '@/features/orders/components/orders-table';
import { TrayPanel } from '@/features/station/components/tray-panel';

const INSTANT = '2026-12-10T02:27:00.000Z';
const DUE = '2026-12-10';

const text = (html: string) =>
  html
    .replace(/<[^>]+>/g, ' ')
    .replace(/&nbsp;/g, ' ')
    .replace(/\s+/g, ' ');

const order = {
  id: 'o1',
  number: '1066',
  customer: { id: 'c1', name: 'Invented Rowing Club' },
  spec: {
    productType: 'lapel_pin',
    process: 'hard_enamel',
    material: 'iron',
    sizeMm: 25,
    quantity: 100,
    overrunPct: 5,
    plating: 'gold',
    secondPlating: null,
    backing: { type: 'butterfly_clutch', count: 1 },
    backLogo: false,
    printing: false,
    epoxy: false,
    sandblast: false,
    packaging: 'individual_bag',
    dueDate: DUE,
    colours: [],
    notes: '',
  },
  status: 'in_production',
  holdReason: null,
  reorderOf: null,
  releasedQuantity: 105,
  traySize: 50,
  releasedAt: INSTANT,
  shippedAt: null,
  createdAt: INSTANT,
  late: false,
  projectedShipAt: INSTANT,
  projectionNote: null,
  warnings: [],
  openGates: [],
  payments: [],
  paidTotal: 0,
  proofs: [],
  routing: [],
  mouldRouting: [],
  mouldPlan: [],
  trays: [],
  moulds: [],
  history: [],
} as unknown as OrderDetail;

const listItem: OrderListItem = {
  id: 'o1',
  number: '1066',
  customer: 'Invented Rowing Club',
  customerId: 'c1',
  title: 'Crest',
  process: 'hard_enamel',
  quantity: 100,
  status: 'in_production',
  openGates: [],
  dueDate: DUE,
  projectedShipAt: INSTANT,
  late: false,
  releasedAt: INSTANT,
  trays: 3,
  createdAt: INSTANT,
};

const station = { id: 's1', name: 'Die striking', nameZh: '冲压', kind: 'strike' as const, instructions: '', safetyNotes: '' };
const state: TrayState = {
  trayId: 't1',
  kind: 'tray',
  phase: 'in_process',
  stepSeq: 1,
  quantity: 50,
  stationId: 's1',
  startedAt: INSTANT,
  waitingSince: INSTANT,
  cureReadyAt: null,
  onHold: false,
  holdReason: null,
  releasedAt: INSTANT,
};
const card = {
  tray: { id: 't1', number: '1066-01', kind: 'tray', revision: 1, releasedQuantity: 50 },
  order: {
    id: 'o1',
    number: '1066',
    title: 'Crest',
    customer: 'Invented Rowing Club',
    process: 'die_struck',
    material: 'brass',
    sizeMm: 25,
    colours: [],
    plating: 'gold',
    backingType: 'butterfly_clutch',
    backingCount: 1,
    packaging: 'individual_bag',
    dueDate: DUE,
    notes: '',
  },
  state,
  routing: [{ seq: 1, stationKind: 'strike', name: 'Die striking' }],
  mouldReady: true,
  artworkUrl: null,
} as unknown as TrayCard;

function screens(lang: 'en' | 'zh-CN') {
  applyLocale(lang);
  const spec = text(renderToStaticMarkup(createElement(SpecCard, { order })));
  const list = text(renderToStaticMarkup(createElement(MemoryRouter, null, createElement(OrdersTable, { orders: [listItem] }))));
  const tablet = text(
    renderToStaticMarkup(
      createElement(TrayPanel, {
        number: '1066-01',
        card,
        state,
        station,
        lang,
        reasonName: (c: string) => c,
        now: Date.parse(INSTANT) + 60_000,
        onAction: () => {},
        onClose: () => {},
      }),
    ),
  );
  return { spec, list, tablet };
}

beforeAll(() => {
  // the reading device is elsewhere: nothing may follow its zone
  process.env.TZ = 'America/New_York';
  setFactoryTimeZone('Asia/Shanghai');
});

describe('one clock and one date format', () => {
  it('the formatter: a fixed instant in the factory zone, per language', () => {
    const zone = { timeZone: 'Asia/Shanghai' };
    expect(formatInstant(INSTANT, { locale: 'en', ...zone })).toBe('10 Dec 2026, 10:27');
    expect(formatInstant(INSTANT, { locale: 'zh-CN', ...zone })).toBe('2026年12月10日 10:27');
    expect(formatInstant(INSTANT, { locale: 'en', ...zone }, 'date')).toBe('10 Dec 2026');
    expect(formatInstant(INSTANT, { locale: 'en', ...zone }, 'time')).toBe('10:27');
    expect(formatInstant(INSTANT, { locale: 'en', ...zone }, 'dayTime')).toBe('Thu 10 Dec, 10:27');
    expect(formatInstant(INSTANT, { locale: 'en', ...zone }, 'dateTime', true)).toBe('10 Dec 2026, 10:27 GMT+8');
    // a day is a day: the same text as the date of an instant on that day, in any zone
    expect(formatDay(DUE, 'en')).toBe('10 Dec 2026');
    expect(formatDay(DUE, 'zh-CN')).toBe('2026年12月10日');
    expect(formatInstant(null, { locale: 'en', ...zone })).toBe('—');
  });

  for (const [lang, date, dateTime] of [
    ['en', '10 Dec 2026', '10 Dec 2026, 10:27'],
    ['zh-CN', '2026年12月10日', '2026年12月10日 10:27'],
  ] as const) {
    it(`${lang}: the spec card, the order list and the tablet show the instant and the due day alike`, () => {
      const { spec, list, tablet } = screens(lang);
      // spec card: projected ship with its time, due day
      expect(spec).toContain(dateTime);
      expect(spec).toContain(date);
      // order list: the due day and the projected day, same format
      expect(list.split(date).length - 1).toBeGreaterThanOrEqual(2);
      // tablet: the due day and the start time of the tray in process here
      expect(tablet).toContain(date);
      expect(tablet).toContain('10:27');
      for (const s of [spec, list, tablet]) {
        // neither UTC (02:27) nor New York (21:27 on the 9th), nor a 12-hour clock
        expect(s).not.toMatch(/\b0?2:27\b|21:27|AM|PM|12\/10\/2026|2026-12-10/);
      }
    });
  }
});

describe('the date pickers’ today is the factory’s', () => {
  it('at 07:30 in Shanghai (23:30 UTC the day before) today is the Shanghai date, and 28 days on counts from it', () => {
    setFactoryTimeZone('Asia/Shanghai');
    const at = Date.parse('2026-06-16T23:30:00Z');
    expect(factoryTodayDate(at)).toBe('2026-06-17');
    expect(factoryDateInDays(28, at)).toBe('2026-07-15');
  });
});

describe('a time typed into a date-time field is on the factory’s clock', () => {
  it('08:30 on 10 Dec 2026 in Shanghai (UTC+8, IANA tz database) is 00:30 UTC; in New York (UTC−5 in December) 13:30 UTC', () => {
    setFactoryTimeZone('Asia/Shanghai');
    expect(factoryLocalToIso('2026-12-10T08:30')).toBe('2026-12-10T00:30:00.000Z');
    setFactoryTimeZone('America/New_York');
    expect(factoryLocalToIso('2026-12-10T08:30')).toBe('2026-12-10T13:30:00.000Z');
    expect(factoryLocalToIso('')).toBeUndefined();
    setFactoryTimeZone('Asia/Shanghai');
  });
});

describe('a day from an answer that holds both days and instants', () => {
  it('a calendar day and an instant on that day in the factory’s zone read the same, short and written out', () => {
    setFactoryTimeZone('Asia/Shanghai');
    expect(formatAnyDay(DUE, 'en')).toBe('10 Dec 2026');
    expect(formatAnyDay(INSTANT, 'en')).toBe('10 Dec 2026');
    expect(formatAnyDay(DUE, 'zh-CN')).toBe('2026年12月10日');
    // 10 December 2026 is a Thursday (from the calendar); ICU writes the English one with or without a comma
    expect(formatAnyDay(INSTANT, 'en', true)).toMatch(/^Thursday,? 10 December 2026$/);
    expect(formatAnyDay(DUE, 'en', true)).toBe(formatAnyDay(INSTANT, 'en', true));
    expect(formatAnyDay(INSTANT, 'zh-CN', true)).toBe('2026年12月10日星期四');
    // 23:30 UTC on 9 Dec is already 10 Dec in Shanghai
    expect(formatAnyDay('2026-12-09T23:30:00Z', 'en')).toBe('10 Dec 2026');
    expect(formatAnyDay(null, 'en')).toBe('—');
  });
});
