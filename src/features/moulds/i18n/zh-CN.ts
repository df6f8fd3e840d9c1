// 模具库的文字，简体中文。键与 en.ts 相同。
import type { MouldsStrings } from './en';

export const zhCN: MouldsStrings = {
  title: '模具库',
  subtitle: '做过的每一副模具：存放位置和使用次数。同一设计的返单直接用原模具，不用再雕模。',
  filter: '查找模具、客户或订单',
  caption: '模具库',
  empty: '还没有模具：订单投产时才开模',
  storageOf: '模具 {{number}} 的存放位置',
  storageExample: '例如 B-4 货架',
  save: '保存',
  retire: '停用',
  unretire: '恢复使用',
  col: {
    number: '模具',
    side: '面',
    state: '状态',
    storedAt: '存放位置',
    useCount: '已用订单数',
    customer: '客户',
    firstOrder: '首单',
    lastUsed: '最近使用',
    actions: '操作',
  },
  side: {
    front: '正面',
    back: '背面',
  },
  status: {
    engraving: '雕模中',
    checking: '试模检查中',
    ready: '可用',
    retired: '已停用',
  },
};
