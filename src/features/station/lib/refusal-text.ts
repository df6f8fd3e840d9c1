// What a refused scan means, in the tablet's language: the English words come from the shared
// module the server also answers with; the Chinese ones are said here from the same code and params.
import { refusalMessage, type PlainMessage } from '@shared/domain/scan-messages';
import type { RefusalParams } from '@shared/domain/guards';
import type { RejectionCode, StationKind } from '@shared/domain/vocabulary';
import { zhCN } from '../i18n/zh-CN';

export type StationLang = 'en' | 'zh-CN';

function kindZh(kind: unknown): string {
  return typeof kind === 'string' && kind in zhCN.kind ? zhCN.kind[kind as StationKind] : '其他工位';
}

function stepZh(name: unknown, seq: unknown, kind: unknown): string {
  if (typeof seq === 'number') return `第 ${seq} 步（${kindZh(kind)}）`;
  return typeof name === 'string' && name ? `“${name}”` : '下一步';
}

function refusalZh(code: RejectionCode, p: RefusalParams, time: (iso: unknown) => string): PlainMessage {
  switch (code) {
    case 'unknown_tray':
      return { title: '找不到托盘', detail: '此编码或编号不属于任何托盘。', next: '请核对流转卡上的编号后重新输入，或询问计划员。' };
    case 'void_traveller':
      return {
        title: '旧流转卡',
        detail: p.currentRevision != null ? `此流转卡已被重印版本（第 ${p.currentRevision} 版）取代。` : '此流转卡已被重印版本取代。',
        next: '请使用此托盘最新的流转卡，并丢弃这张旧卡；如没有新卡，请询问计划员。',
      };
    case 'bad_signature':
      return { title: '流转卡不是真的', detail: '此编码不是本厂打印的，或已被改动。', next: '不要加工此托盘，请交给主管。' };
    case 'wrong_station':
      return p.action === 'finish'
        ? {
            title: '工位不对',
            detail: `此托盘正在 ${stepZh(p.expectedName, p.expectedSeq, p.expectedKind)} 加工，不在${kindZh(p.stationKind)}。`,
            next: `请在${kindZh(p.expectedKind)}工位完成，或请主管放行。`,
          }
        : {
            title: '工位不对',
            detail: `此托盘的下一步是 ${stepZh(p.expectedName, p.expectedSeq, p.expectedKind)}，不是${kindZh(p.stationKind)}。`,
            next: `请把托盘送到${kindZh(p.expectedKind)}。如果必须在这里做，请主管放行。`,
          };
    case 'not_started':
      return { title: '尚未开始', detail: `此托盘的 ${stepZh(p.stepName, p.stepSeq, p.stepKind)} 还没有开始。`, next: '请先扫描“开始”，做完后再扫描“完成”。' };
    case 'already_started':
      return {
        title: '已经开始',
        detail: `此托盘自 ${time(p.startedAt)} 起已在 ${stepZh(p.stepName, p.stepSeq, p.stepKind)} 加工。`,
        next: '请先完成。如果是误开始，请找主管。',
      };
    case 'curing':
      return {
        title: '仍在烘烤',
        detail: `烘烤还需 ${typeof p.minutesLeft === 'number' ? p.minutesLeft : 0} 分钟，${time(p.readyAt)} 可以取出。`,
        next: '请把托盘留在烤炉里等待。只有主管可以提前放行。',
      };
    case 'quantity_mismatch':
      return {
        title: '数量对不上',
        detail: `良品 ${p.good} + 报废 ${p.scrap} 必须等于来料 ${p.quantityIn} 件${typeof p.rework === 'number' && p.rework > 0 ? `，返工 ${p.rework} 件计入良品` : ''}。`,
        next: '请重新清点，改正良品和报废数量。',
      };
    case 'on_hold':
      return { title: '托盘已暂停', detail: p.holdReason ? `此托盘已暂停：${p.holdReason}。` : '此托盘已暂停。', next: '请不要加工。须由主管先解除暂停。' };
    case 'mould_not_ready':
      return {
        title: '模具未就绪',
        detail: `此订单的模具还没有准备好，${stepZh(p.stepName, p.stepSeq, p.stepKind)} 不能开始。`,
        next: '请把托盘放回，先做别的托盘。模具何时就绪请问模具房。',
      };
    case 'bad_time': {
      const when = time(p.occurredAt);
      const detail =
        p.reason === 'future'
          ? `扫描时间（${when}）比服务器时钟还晚。`
          : p.reason === 'too_old'
            ? `扫描时间（${when}）已超过 7 天。`
            : p.reason === 'before_release'
              ? `扫描时间（${when}）早于托盘下发时间（${time(p.limit)}）。`
              : p.reason === 'before_last_event'
                ? `扫描时间（${when}）早于此托盘最后一次记录的扫描（${time(p.limit)}）。`
                : '扫描时间无法识别。';
      return { title: '时间不对', detail, next: '请检查平板时钟和网络，并告诉主管以便更正。' };
    }
    case 'not_on_hold':
      return { title: '没有暂停', detail: '此托盘没有暂停，无需解除。', next: '请继续加工。' };
    case 'finished':
      return {
        title: '托盘已结束',
        detail: p.phase === 'scrapped' ? '此托盘的全部工件已报废。' : p.phase === 'merged' ? '此托盘已并入另一个托盘。' : '此托盘的全部工序已完成。',
        next: '请确认扫的是正确的流转卡。如托盘仍在车间，请找主管。',
      };
    case 'scrap_reason_missing':
      return p.for === 'hold'
        ? { title: '需要原因', detail: p.reason ? `“${p.reason}”不是已有的暂停原因。` : '暂停需要原因。', next: '请从列表中选择原因。' }
        : {
            title: '需要报废原因',
            detail: p.reason ? `“${p.reason}”不是已有的报废原因。` : `有 ${typeof p.scrap === 'number' ? p.scrap : 0} 件报废但没有原因。`,
            next: '请从列表中选择报废原因。',
          };
    case 'bad_override':
      return p.reason === 'release_needs_supervisor'
        ? { title: '需要主管', detail: '只有主管可以解除暂停。', next: '请主管用工牌和密码确认。' }
        : { title: '放行无效', detail: '本次扫描的主管放行缺失、已用过，或属于别的托盘。', next: '请主管用工牌和密码重新确认。' };
    case 'invalid_event':
      return { title: '扫描无法识别', detail: '扫描发送时缺少信息或信息有误。', next: '请重新扫描托盘。如反复出现，请告诉主管。' };
    case 'station_not_allowed':
      return { title: '不是本平板的工位', detail: '本平板只能记录它自己工位的扫描。', next: '请在该工位的平板上扫描托盘，或请管理员把本平板调到那个工位。' };
    case 'badge_failures':
      return {
        title: '工牌或密码多次错误',
        detail: '这台平板上连续多次输错工牌或密码，现在需要等待后才能再试。',
        next: '请查看是谁在使用平板。如果不是有人忘了密码，请在管理页面关闭这台平板。',
      };
  }
}

/** A refusal in the tablet's language; `reasonName` turns a hold reason's code into its name. */
export function describeRefusal(
  lang: StationLang,
  code: RejectionCode,
  params: RefusalParams = {},
  time: (iso: unknown) => string,
  reasonName: (code: string) => string = (c) => c,
): PlainMessage {
  const named = typeof params.holdReason === 'string' ? { ...params, holdReason: reasonName(params.holdReason) } : params;
  return lang === 'zh-CN' ? refusalZh(code, named, time) : refusalMessage(code, named, time);
}

/** The name of a reason code in the tablet's language; free text (a note) stays as typed. */
export function reasonNamer(reasons: readonly { code: string; name: string; nameZh: string }[], lang: StationLang): (code: string) => string {
  return (code) => {
    const r = reasons.find((x) => x.code === code);
    return r ? (lang === 'zh-CN' ? r.nameZh : r.name) : code;
  };
}
