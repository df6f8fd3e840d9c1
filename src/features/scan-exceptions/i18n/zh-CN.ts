// 被拒扫描页面的文字（简体中文）。键与 en.ts 相同。
import type { ScanExceptionsStrings } from './en';

export const zhCN: ScanExceptionsStrings = {
  page: {
    title: '被拒扫描',
    subtitle: '服务器拒收的扫描都保留在这里，一条也不会丢。原因排除后可重新提交，或写明处理办法后关闭。',
    show: '显示',
    open: '待处理',
    resolved: '已处理',
    all: '全部',
  },
  row: {
    scan: '扫描',
    heading: '{{station}}：{{what}}',
    unknownStation: '未知工位',
    unknownOperator: '未知操作员',
    times: '{{operator}} · 扫描于 {{scanned}} · 收到于 {{received}}',
    told: '当时提示操作员：',
    resolved: '已处理',
    acceptedLate: '缺少的扫描到达后已接受',
    acceptedOnRetry: '重新提交后已接受',
    retry: '立即重新提交',
    whatWasDone: '处理办法',
    notePlaceholder: '处理办法（例如：已在正确的工位重新扫描）',
    resolve: '关闭',
    stillRefused: '仍被拒收：{{message}}',
    acceptedNow: '现已接受。',
    notDone: '未完成',
  },
  empty: {
    title: '没有被拒的扫描',
    text: '平板发来的扫描全部被接受。',
  },
};
