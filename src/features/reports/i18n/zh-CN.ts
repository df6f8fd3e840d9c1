// 报表页面中说明数字单位的文字（简体中文）。键与 en.ts 相同。
import type { ReportsStrings } from './en';

export const zhCN: ReportsStrings = {
  cycleTime: {
    loading: '正在计算周期时间…',
    note: '排队时间从上一工序完成（或固化结束、或投产）算到开工；加工时间从开工算到完工。每个时间都同时以钟点分钟（含夜间和休息日）和工作分钟（只算该工位的班次）显示。',
    flowTitle: '流动效率',
    noTray: '此期间没有完成的托盘。',
    noTrayStation: '此期间没有完成的托盘（按单个工位查看时不显示）。',
    headline: '的工作时间用于托盘的加工工序：流动时间 {{flow}} 中加工 {{process}}，两者均为工作小时，合计已完成的 {{trays}} 个托盘。',
    calendar: '改按钟点计算（加工和流动时间均为钟点小时：{{flow}} 中 {{process}}）：{{share}}。',
    cure: '烤炉固化必不可少但无人值守，因此不计为增值时间：它占工作时间的 {{working}}、钟点时间的 {{calendar}}，单独列出。',
    chartTitle: '各类工位的排队和加工时间（工作分钟，p50）',
    chartCaption: '工作分钟：只算该工位的班次。表格在旁边列出钟点分钟；CSV 文件含完整分布（包括 p95）。',
    axis: '工作分钟',
    queueP50: '等待（p50，工作分钟）',
    processP50: '加工（p50，工作分钟）',
    table: '周期时间表',
    col: {
      kind: '工位类别',
      processN: '加工次数',
      processClock: '加工 {{stat}}（钟点分钟）',
      processWorking: '加工 {{stat}}（工作分钟）',
      queueN: '排队次数',
      queueClock: '排队 {{stat}}（钟点分钟）',
      queueWorking: '排队 {{stat}}（工作分钟）',
    },
    stat: { p50: 'p50', p85: 'p85', mean: '平均' },
  },
};
