// Every namespace of text, per language. A feature keeps its words in
// src/features/<feature>/i18n/en.ts and zh-CN.ts and is listed here once.
import { en as common } from './common/en';
import { zhCN as commonZh } from './common/zh-CN';
import { en as station } from '@/features/station/i18n/en';
import { zhCN as stationZh } from '@/features/station/i18n/zh-CN';

export const resources = {
  en: { common, station },
  'zh-CN': { common: commonZh, station: stationZh },
} as const;

export type Namespace = keyof (typeof resources)['en'];
