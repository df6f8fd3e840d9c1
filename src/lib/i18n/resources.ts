// Every namespace of text, per language. A feature keeps its words in
// src/features/<feature>/i18n/en.ts and zh-CN.ts and is listed here once.
import { en as common } from './common/en';
import { zhCN as commonZh } from './common/zh-CN';
import { en as station } from '@/features/station/i18n/en';
import { zhCN as stationZh } from '@/features/station/i18n/zh-CN';
import { en as orders } from '@/features/orders/i18n/en';
import { zhCN as ordersZh } from '@/features/orders/i18n/zh-CN';
import { en as users } from '@/features/users/i18n/en';
import { zhCN as usersZh } from '@/features/users/i18n/zh-CN';
import { en as portal } from '@/features/customer-status/i18n/en';
import { zhCN as portalZh } from '@/features/customer-status/i18n/zh-CN';
import { en as projections } from '@/features/projections/i18n/en';
import { zhCN as projectionsZh } from '@/features/projections/i18n/zh-CN';
import { en as reports } from '@/features/reports/i18n/en';
import { zhCN as reportsZh } from '@/features/reports/i18n/zh-CN';
import { en as costing } from '@/features/costing/i18n/en';
import { zhCN as costingZh } from '@/features/costing/i18n/zh-CN';
import { en as quotes } from '@/features/quotes/i18n/en';
import { zhCN as quotesZh } from '@/features/quotes/i18n/zh-CN';
import { en as live } from '@/features/live/i18n/en';
import { zhCN as liveZh } from '@/features/live/i18n/zh-CN';
import { en as scanExceptions } from '@/features/scan-exceptions/i18n/en';
import { zhCN as scanExceptionsZh } from '@/features/scan-exceptions/i18n/zh-CN';
import { en as trays } from '@/features/trays/i18n/en';
import { zhCN as traysZh } from '@/features/trays/i18n/zh-CN';
import { en as admin } from '@/features/admin/i18n/en';
import { zhCN as adminZh } from '@/features/admin/i18n/zh-CN';
import { en as sales } from '@/features/sales/i18n/en';
import { zhCN as salesZh } from '@/features/sales/i18n/zh-CN';
import { en as shipping } from '@/features/shipping/i18n/en';
import { zhCN as shippingZh } from '@/features/shipping/i18n/zh-CN';
import { en as loads } from '@/features/loads/i18n/en';
import { zhCN as loadsZh } from '@/features/loads/i18n/zh-CN';
import { en as moulds } from '@/features/moulds/i18n/en';
import { zhCN as mouldsZh } from '@/features/moulds/i18n/zh-CN';

export const resources = {
  en: { common, station, orders, users, portal, projections, costing, quotes, reports, live, scanExceptions, trays, admin, sales, shipping, loads, moulds },
  'zh-CN': {
    common: commonZh,
    station: stationZh,
    orders: ordersZh,
    users: usersZh,
    portal: portalZh,
    projections: projectionsZh,
    costing: costingZh,
    quotes: quotesZh,
    reports: reportsZh,
    live: liveZh,
    scanExceptions: scanExceptionsZh,
    trays: traysZh,
    admin: adminZh,
    sales: salesZh,
    shipping: shippingZh,
    loads: loadsZh,
    moulds: mouldsZh,
  },
} as const;

export type Namespace = keyof (typeof resources)['en'];
