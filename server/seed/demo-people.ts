import type { Role } from '@shared/domain/vocabulary';

/** The invented demo factory's people. Every demo account shares one password (README). */
export const DEMO_FACTORY = { name: 'Tallowmere Badge Works', town: 'Ostrel Vale', timeZone: 'Asia/Shanghai' };
export const DEMO_PASSWORD = 'trayce-demo';

export interface DemoPerson {
  name: string;
  email: string;
  role: Role;
  badge?: string;
  pin?: string;
  /** the language the person reads the product in (default English) */
  locale?: 'en' | 'zh-CN';
}

export const DEMO_PEOPLE: DemoPerson[] = [
  { name: 'Ines Varga', email: 'admin@tallowmere.test', role: 'admin' },
  { name: 'Mei Lindqvist', email: 'planner@tallowmere.test', role: 'planner' },
  { name: 'Dario Okonjo', email: 'supervisor@tallowmere.test', role: 'supervisor', badge: 'S-100', pin: '2468' },
  { name: 'Tomasz Achterberg', email: 'manager@tallowmere.test', role: 'manager' },
  { name: 'Rosa Kettering', email: 'sales@tallowmere.test', role: 'sales' },
  { name: 'Chen Xiuying', email: 'operator@tallowmere.test', role: 'operator', badge: 'B-201', pin: '1357' },
  { name: 'Huang Yimin', email: 'huang.yimin@tallowmere.test', role: 'operator', badge: 'B-202', pin: '2580', locale: 'zh-CN' },
  { name: 'Amara Quist', email: 'amara.quist@tallowmere.test', role: 'operator', badge: 'B-203', pin: '3691' },
  { name: 'Pedro Salvatierra', email: 'pedro.salvatierra@tallowmere.test', role: 'operator', badge: 'B-204', pin: '4702' },
  { name: 'Zhou Lanfen', email: 'zhou.lanfen@tallowmere.test', role: 'operator', badge: 'B-205', pin: '5813', locale: 'zh-CN' },
  { name: 'Nia Brennagh', email: 'nia.brennagh@tallowmere.test', role: 'supervisor', badge: 'S-101', pin: '8024' },
];
