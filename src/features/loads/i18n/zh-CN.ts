// 烘炉与电镀批次的文字，简体中文。键与 en.ts 相同。
import type { LoadsStrings } from './en';

export const zhCN: LoadsStrings = {
  title: '烘炉与电镀批次',
  subtitle: '等待进炉的托盘按固化曲线分组，等待电镀的按电镀颜色分组：可从不同订单中选托盘凑成一批。',
  safety: '烘炉高温，电镀槽内有腐蚀性和有毒化学品：按工位注意事项戴耐热手套、护目镜并保持通风。以当地法规和工厂自己的规程为准。',
  open: '进行中的批次',
  waitingOven: '等待进炉',
  waitingPlating: '等待电镀',
  noOven: '没有托盘等待进炉',
  noPlating: '没有托盘等待电镀',
  cureLabel: '固化 {{minutes}} 分钟',
  groupSummary: '{{trays}} 个托盘 · {{pieces}} 件 · 最久已等 {{oldest}}',
  traysWaiting: '等待中的托盘：{{title}}',
  choose: '选择',
  tray: '托盘',
  order: '订单号',
  customer: '客户',
  pieces: '件数',
  waiting: '已等待',
  putIn: '把托盘 {{number}} 放进这一批',
  makeCure: '用 {{count}} 个托盘组成一炉（{{pieces}} 件）',
  makePlate: '用 {{count}} 个托盘组成一槽电镀（{{pieces}} 件）',
  loadPieces: '{{pieces}} 件',
  keepsOwn: '每张订单的托盘和件数各自保留；拆批后每张订单拿回的正好是它放进去的。',
  orderLine: '订单 <strong>{{number}}</strong>：{{pieces}} 件，在 {{trays}}',
  split: '拆回原来的托盘',
};
