// The words printed on travellers and packing lists, in the factory's print language (the admin's
// setting, English by default). The trade's names of the codes match the screens' words; colour
// names, titles, customers and step names print as they were written.
import type { Locale, Material, Plating, Process } from '@shared/domain/vocabulary';
import type { MouldTool } from '@shared/domain/routing';
import { formatDay, formatInstant } from '@shared/domain/time-format';

import { TRADE_NAMES, type Backing, type Packaging } from '@shared/domain/trade-names';

/** fittings print inside a sentence ("2 × butterfly clutch"): the English names in lower case */
const lowerCase = <K extends string>(names: Record<K, string>) =>
  Object.fromEntries(Object.entries(names).map(([k, v]) => [k, (v as string).toLowerCase()])) as Record<K, string>;

export interface PrintWords {
  locale: Locale;
  process: Record<Process, string>;
  material: Record<Material, string>;
  plating: Record<Plating, string>;
  packaging: Record<Packaging, string>;
  backing: Record<Backing, string>;
  tool: Record<MouldTool, string>;
  traveller: {
    trayTraveller: string;
    mouldTraveller: string;
    rev: (n: number) => string;
    order: (number: string, customer: string) => string;
    mould: string;
    pieces: (n: number) => string;
    labels: { process: string; plating: string; fittings: string; packing: string; due: string };
    twoTone: (first: string, second: string) => string;
    fittings: (count: number, name: string) => string;
    noFittings: string;
    proof: (revision: number, pdf: boolean) => string;
    noProof: string;
    noArtwork: string;
    mouldCaption: (tool: string, stored: { at: string | null } | null, make: boolean) => string;
    splitFrom: (number: string | null) => string;
    trayOf: (n: number | null, of: number) => string;
    cure: (minutes: number) => string;
    reprint: (revision: number) => string;
    revision: (revision: number) => string;
    title: string;
  };
  packing: {
    title: string;
    order: string;
    orderTitle: string;
    customer: string;
    shipment: string;
    shipped: string;
    carrier: string;
    tracking: string;
    cartons: string;
    perCarton: string;
    pieces: string;
    weightPerCarton: string;
    total: string;
    inAll: (kg: string) => string;
    summary: (ordered: number, soFar: number, more: number) => string;
    short: string;
    signatures: string;
  };
  /** "10 Dec 2026" · "2026年12月10日": a calendar day such as the due date */
  day: (day: string) => string;
  /** an instant in the factory's zone, its zone named */
  when: (iso: string, timeZone: string) => string;
  kg: (n: number) => string;
}

const day = (locale: Locale) => (d: string) => formatDay(d, locale);
const when = (locale: Locale) => (iso: string, timeZone: string) => formatInstant(iso, { locale, timeZone }, 'dateTime', true);
const kg = (locale: Locale) => (n: number) => `${n.toLocaleString(locale === 'zh-CN' ? 'zh-CN' : 'en-GB', { maximumFractionDigits: 3 })} kg`;

const EN: PrintWords = {
  locale: 'en',
  process: TRADE_NAMES.en.process,
  material: TRADE_NAMES.en.material,
  plating: TRADE_NAMES.en.plating,
  packaging: TRADE_NAMES.en.packaging,
  backing: lowerCase(TRADE_NAMES.en.backing),
  tool: { front_mould: 'Front mould', back_mould: 'Back mould', cutting_die: 'Cutting die' },
  traveller: {
    trayTraveller: 'TRAY TRAVELLER',
    mouldTraveller: 'MOULD TRAVELLER',
    rev: (n) => `REV ${n}`,
    order: (number, customer) => `Order ${number} · ${customer}`,
    mould: 'Mould',
    pieces: (n) => `${n} pcs`,
    labels: { process: 'Process', plating: 'Plating', fittings: 'Fittings', packing: 'Packing', due: 'Due' },
    twoTone: (a, b) => `${a} and ${b.toLowerCase()} (two-tone)`,
    fittings: (count, name) => `${count} × ${name}`,
    noFittings: 'None',
    proof: (revision, pdf) => `Proof rev ${revision}${pdf ? ' (PDF)' : ''}`,
    noProof: 'No approved proof',
    noArtwork: 'No artwork image',
    mouldCaption: (tool, stored, make) =>
      `${tool} · ${stored ? `stored${stored.at ? ` at ${stored.at}` : ''}, check only` : `new, ${make ? 'make' : 'engrave'} and check`}`,
    splitFrom: (number) => `Split from ${number ?? 'another tray'}`,
    trayOf: (n, of) => `Tray ${n ?? '?'} of ${of}`,
    cure: (m) => `${m} min`,
    reprint: (r) => `Reprint: revision ${r} replaces all earlier copies`,
    revision: (r) => `Revision ${r}`,
    title: 'Travellers',
  },
  packing: {
    title: 'Packing list',
    order: 'Order',
    orderTitle: 'Title',
    customer: 'Customer',
    shipment: 'Shipment',
    shipped: 'Shipped',
    carrier: 'Carrier',
    tracking: 'Tracking number',
    cartons: 'Cartons',
    perCarton: 'Pieces per carton',
    pieces: 'Pieces',
    weightPerCarton: 'Weight per carton',
    total: 'Total',
    inAll: (w) => `${w} in all`,
    summary: (ordered, soFar, more) =>
      `Ordered: ${ordered} pieces. Shipped so far, including this shipment: ${soFar} pieces.${more > 0 ? ` ${more} pieces are still to come.` : ''}`,
    short: 'This order ships fewer pieces than ordered, by agreement.',
    signatures: 'Packed by: ____________________    Checked by: ____________________',
  },
  day: day('en'),
  when: when('en'),
  kg: kg('en'),
};

const ZH: PrintWords = {
  locale: 'zh-CN',
  process: TRADE_NAMES['zh-CN'].process,
  material: TRADE_NAMES['zh-CN'].material,
  plating: TRADE_NAMES['zh-CN'].plating,
  packaging: TRADE_NAMES['zh-CN'].packaging,
  backing: TRADE_NAMES['zh-CN'].backing,
  tool: { front_mould: '正面模具', back_mould: '背面模具', cutting_die: '冲切刀模' },
  traveller: {
    trayTraveller: '托盘流程卡',
    mouldTraveller: '模具流程卡',
    rev: (n) => `第 ${n} 版`,
    order: (number, customer) => `订单 ${number} · ${customer}`,
    mould: '模具',
    pieces: (n) => `${n} 件`,
    labels: { process: '工艺', plating: '电镀', fittings: '配件', packing: '包装', due: '交期' },
    twoTone: (a, b) => `${a}、${b}（双色电镀）`,
    fittings: (count, name) => `${count} × ${name}`,
    noFittings: '无',
    proof: (revision, pdf) => `稿件第 ${revision} 版${pdf ? '（PDF）' : ''}`,
    noProof: '没有已确认的稿件',
    noArtwork: '没有图稿图片',
    mouldCaption: (tool, stored, make) =>
      `${tool} · ${stored ? `库存${stored.at ? `（${stored.at}）` : ''}，只需检验` : `新开，${make ? '制作' : '雕刻'}并检验`}`,
    splitFrom: (number) => `拆分自 ${number ?? '另一托盘'}`,
    trayOf: (n, of) => `第 ${n ?? '?'} 盘，共 ${of} 盘`,
    cure: (m) => `${m} 分钟`,
    reprint: (r) => `补打：第 ${r} 版，以前各版作废`,
    revision: (r) => `第 ${r} 版`,
    title: '流程卡',
  },
  packing: {
    title: '装箱单',
    order: '订单',
    orderTitle: '名称',
    customer: '客户',
    shipment: '批次',
    shipped: '发货时间',
    carrier: '承运商',
    tracking: '运单号',
    cartons: '箱数',
    perCarton: '每箱件数',
    pieces: '件数',
    weightPerCarton: '每箱重量',
    total: '合计',
    inAll: (w) => `共 ${w}`,
    summary: (ordered, soFar, more) => `订购：${ordered} 件。连同本批已发：${soFar} 件。${more > 0 ? `还有 ${more} 件待发。` : ''}`,
    short: '经双方同意，此订单少于订购数量发货。',
    signatures: '装箱人：____________________    检查人：____________________',
  },
  day: day('zh-CN'),
  when: when('zh-CN'),
  kg: kg('zh-CN'),
};

export function printWords(locale: Locale | undefined): PrintWords {
  return locale === 'zh-CN' ? ZH : EN;
}
