import type { StationKind } from '@shared/domain/vocabulary';
import type { DemoPerson } from './demo-people';

/** The rest of the demo factory's floor crew (invented people; same demo password). */
export const DEMO_CREW: DemoPerson[] = [
  { name: 'Liang Wenjie', email: 'liang.wenjie@tallowmere.test', role: 'operator', badge: 'B-206', pin: '6924', locale: 'zh-CN' },
  { name: 'Farida Osei-Bonsu', email: 'farida.oseibonsu@tallowmere.test', role: 'operator', badge: 'B-207', pin: '7035' },
  { name: 'Sun Meiling', email: 'sun.meiling@tallowmere.test', role: 'operator', badge: 'B-208', pin: '8146', locale: 'zh-CN' },
  { name: 'Tobias Wrenfield', email: 'tobias.wrenfield@tallowmere.test', role: 'operator', badge: 'B-209', pin: '9257' },
  { name: 'Xu Haoran', email: 'xu.haoran@tallowmere.test', role: 'operator', badge: 'B-210', pin: '1468', locale: 'zh-CN' },
  { name: 'Ilse Marchetti', email: 'ilse.marchetti@tallowmere.test', role: 'operator', badge: 'B-211', pin: '2579' },
  { name: 'Gao Shuang', email: 'gao.shuang@tallowmere.test', role: 'operator', badge: 'B-212', pin: '3680', locale: 'zh-CN' },
];

const at = (name: string) => `${name}@tallowmere.test`;

/** Who works which stations: a traveller waits for a free place at the station and a free person of its crew. */
export const STATION_CREW: Record<StationKind, string[]> = {
  engrave: [at('liang.wenjie'), at('operator')],
  mould_check: [at('operator'), at('liang.wenjie')],
  strike: [at('operator'), at('xu.haoran')],
  cast: [at('xu.haoran'), at('operator')],
  trim: [at('huang.yimin'), at('gao.shuang')],
  post: [at('huang.yimin'), at('gao.shuang'), at('tobias.wrenfield')],
  solder: [at('huang.yimin'), at('tobias.wrenfield')],
  fill: [at('amara.quist'), at('pedro.salvatierra'), at('sun.meiling')],
  cure: [at('amara.quist'), at('sun.meiling'), at('zhou.lanfen')],
  stone: [at('tobias.wrenfield'), at('huang.yimin')],
  polish: [at('tobias.wrenfield'), at('gao.shuang')],
  sandblast: [at('tobias.wrenfield'), at('xu.haoran')],
  plate: [at('ilse.marchetti'), at('pedro.salvatierra')],
  antique: [at('pedro.salvatierra'), at('ilse.marchetti')],
  print: [at('ilse.marchetti'), at('tobias.wrenfield')],
  epoxy: [at('ilse.marchetti'), at('farida.oseibonsu')],
  inspect: [at('zhou.lanfen'), at('farida.oseibonsu')],
  clutch: [at('zhou.lanfen'), at('sun.meiling'), at('gao.shuang')],
  bag: [at('zhou.lanfen'), at('gao.shuang'), at('sun.meiling')],
  pack: [at('zhou.lanfen'), at('gao.shuang')],
  dispatch: [at('zhou.lanfen')],
};
