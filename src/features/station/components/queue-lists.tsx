import { useTranslation } from 'react-i18next';
import { Flame, Hand, Hourglass, Wrench } from 'lucide-react';
import { formatDuration } from '../lib/format';
import type { QueueItem } from '../lib/station-queue';

function Row({
  item,
  onOpen,
  detail,
  tone,
  reasonName,
}: {
  item: QueueItem;
  onOpen: (n: string) => void;
  detail: string;
  tone?: 'ok' | 'warn';
  reasonName: (code: string) => string;
}) {
  const { t } = useTranslation('station');
  const held = item.state.onHold;
  return (
    <li>
      <button
        type="button"
        onClick={() => onOpen(item.number)}
        data-testid="queue-row"
        data-held={held ? 'yes' : 'no'}
        className={`flex min-h-16 w-full items-center justify-between gap-3 rounded-xl px-3 py-2 text-left shadow-sm hover:ring-harbour-600 ${held ? 'border-2 border-dashed border-warn-700 bg-warn-50' : 'bg-white ring-1 ring-harbour-100'}`}
      >
        <span className="flex flex-col">
          <span className="font-mono text-xl font-bold">{item.number}</span>
          <span className="text-sm text-harbour-700">{item.card.order ? `${item.card.order.number} · ${item.card.order.title}` : ''}</span>
        </span>
        <span className="flex flex-col items-end">
          <span className="font-bold">{t('lists.pieces', { count: item.state.quantity })}</span>
          {held ? (
            <span className="flex items-center gap-1 text-sm font-bold text-warn-700" data-testid="queue-held">
              <Hand className="h-4 w-4" aria-hidden />{' '}
              {item.state.holdReason ? t('lists.heldFor', { reason: reasonName(item.state.holdReason) }) : t('lists.held')}
            </span>
          ) : (
            <span className={`text-sm font-bold ${tone === 'ok' ? 'text-ok-700' : tone === 'warn' ? 'text-warn-700' : 'text-harbour-700'}`}>{detail}</span>
          )}
        </span>
      </button>
    </li>
  );
}

/** The station's travellers: in process here, in the oven (cure stations), waiting for this station. */
export function QueueLists({
  inProcess,
  curing,
  waiting,
  onOpen,
  isOven,
  reasonName,
}: {
  inProcess: QueueItem[];
  curing: QueueItem[];
  waiting: QueueItem[];
  onOpen: (n: string) => void;
  isOven: boolean;
  reasonName: (code: string) => string;
}) {
  const { t } = useTranslation('station');
  const cureDetail = (i: QueueItem) => (i.minutes <= 0 ? t('lists.readyNow') : t('lists.readyIn', { duration: formatDuration(t, i.minutes) }));
  const section = (
    id: string,
    title: string,
    icon: React.ReactNode,
    items: QueueItem[],
    detail: (i: QueueItem) => string,
    tone?: (i: QueueItem) => 'ok' | 'warn' | undefined,
  ) => (
    <section aria-labelledby={id} className="flex flex-col gap-2">
      <h2 id={id} className="flex items-center gap-2 text-xl font-bold text-harbour-900">
        {icon} {title} <span className="rounded-full bg-harbour-100 px-2 text-base">{items.length}</span>
      </h2>
      {items.length === 0 ? (
        <p className="text-harbour-700">{t('lists.none')}</p>
      ) : (
        <ul className="flex flex-col gap-2">
          {items.slice(0, 60).map((i) => (
            <Row key={i.number} item={i} onOpen={onOpen} detail={detail(i)} tone={tone?.(i)} reasonName={reasonName} />
          ))}
        </ul>
      )}
    </section>
  );
  return (
    <div className="flex flex-col gap-5">
      {section('list-in-process', t('lists.inProcess'), <Wrench className="h-5 w-5" aria-hidden />, inProcess, (i) =>
        t('lists.elapsed', { duration: formatDuration(t, i.minutes) }),
      )}
      {(isOven || curing.length > 0) &&
        section('list-curing', t('lists.curing'), <Flame className="h-5 w-5" aria-hidden />, curing, cureDetail, (i) => (i.minutes <= 0 ? 'ok' : 'warn'))}
      {section(
        'list-waiting',
        t('lists.waiting'),
        <Hourglass className="h-5 w-5" aria-hidden />,
        waiting,
        (i) => (i.state.phase === 'curing' ? cureDetail(i) : t('lists.waited', { duration: formatDuration(t, i.minutes) })),
        (i) => (i.state.phase === 'curing' ? (i.minutes <= 0 ? 'ok' : 'warn') : undefined),
      )}
    </div>
  );
}
