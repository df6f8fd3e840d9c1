import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { RotateCcw, CheckCheck } from 'lucide-react';
import { useQuery } from '@tanstack/react-query';
import type { ReasonCodeView } from '@shared/schemas/stations';
import { api } from '@/lib/api-client';
import { currentLocale } from '@/lib/i18n';
import { exceptionMessage, type DescribeRefusal, type ReasonName } from '../lib/exception-text';
import type { ScanExceptionView } from '@shared/schemas/scans';
import { Button } from '@/components/ui/button';
import { EmptyState, ErrorPanel, Pill } from '@/components/ui/panels';
import { useResolveScanException, useRetryScanException } from '../api/decide-scan-exception';
import { formatDateTime } from '@/lib/datetime';

/** In the factory's zone, as every screen writes times. */
function when(iso: string | null) {
  return formatDateTime(iso);
}

function ExceptionRow({
  item,
  canDecide,
  reasonName,
  describe,
}: {
  item: ScanExceptionView;
  canDecide: boolean;
  reasonName: ReasonName;
  describe?: DescribeRefusal;
}) {
  const { t } = useTranslation('scanExceptions');
  const { t: tc } = useTranslation('common');
  const retry = useRetryScanException();
  const resolve = useResolveScanException();
  const [note, setNote] = useState('');
  const time = (iso: unknown) => (typeof iso === 'string' ? formatDateTime(iso) : '—');
  const m = exceptionMessage(item, reasonName, time, describe);
  const retried = retry.data;
  const stillRefused =
    retried?.status === 'rejected'
      ? retried.code
        ? exceptionMessage({ code: retried.code, params: retried.params ?? {} }, reasonName, time, describe).title
        : (retried.message ?? '')
      : '';
  return (
    <li className="rounded-xl border border-harbour-100 bg-white p-4 shadow-sm" data-testid="exception-row">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div className="min-w-0">
          <p className="text-lg font-bold">
            <span className="font-mono">{item.trayNumber ?? item.scannedCode ?? '—'}</span> ·{' '}
            {t('row.heading', { what: item.type ? tc(`scanType.${item.type}`) : t('row.scan'), station: item.stationName ?? t('row.unknownStation') })}
          </p>
          <p className="text-sm text-harbour-700">
            {t('row.times', { operator: item.operatorName ?? t('row.unknownOperator'), scanned: when(item.occurredAt), received: when(item.receivedAt) })}
          </p>
          <p className="mt-2">
            <Pill tone="stop">{m.title}</Pill> <span className="ml-1">{m.detail}</span>
          </p>
          <p className="mt-1 text-sm">
            <span className="font-bold">{t('row.told')}</span>
            {m.next}
          </p>
          {item.resolvedAt && (
            <p className="mt-2">
              <Pill tone="ok">{t('row.resolved')}</Pill> {when(item.resolvedAt)} ·{' '}
              {item.resolution === 'accepted_late'
                ? t('row.acceptedLate')
                : item.resolution === 'accepted_on_retry'
                  ? t('row.acceptedOnRetry')
                  : item.resolution}
            </p>
          )}
        </div>
        {canDecide && !item.resolvedAt && (
          <div className="flex w-full max-w-md flex-col gap-2">
            <Button variant="secondary" onClick={() => retry.mutate(item.id)} disabled={retry.isPending}>
              <RotateCcw className="h-5 w-5" aria-hidden /> {t('row.retry')}
            </Button>
            <form
              className="flex gap-2"
              onSubmit={(e) => {
                e.preventDefault();
                resolve.mutate({ id: item.id, resolution: note.trim() });
              }}
            >
              <label className="sr-only" htmlFor={`note-${item.id}`}>
                {t('row.whatWasDone')}
              </label>
              <input
                id={`note-${item.id}`}
                value={note}
                onChange={(e) => setNote(e.target.value)}
                placeholder={t('row.notePlaceholder')}
                className="min-h-11 flex-1 rounded-lg border-2 border-harbour-100 px-3"
              />
              <Button type="submit" disabled={note.trim().length < 3 || resolve.isPending}>
                <CheckCheck className="h-5 w-5" aria-hidden /> {t('row.resolve')}
              </Button>
            </form>
            {retried && retried.status === 'rejected' && (
              <p role="status" className="text-sm font-bold text-stop-700">
                {t('row.stillRefused', { message: stillRefused })}
              </p>
            )}
            {retried && retried.status === 'accepted' && (
              <p role="status" className="text-sm font-bold text-ok-700">
                {t('row.acceptedNow')}
              </p>
            )}
            {(retry.error || resolve.error) && <ErrorPanel title={t('row.notDone')} message={(retry.error ?? resolve.error)!.message} />}
          </div>
        )}
      </div>
    </li>
  );
}

/** Refused scans for supervisors: what happened, who, where, and the decision. */
export function ScanExceptionsList({ items, canDecide, describe }: { items: ScanExceptionView[]; canDecide: boolean; describe?: DescribeRefusal }) {
  const { t } = useTranslation('scanExceptions');
  const reasons = useQuery({ queryKey: ['reason-codes', 'office'], queryFn: () => api.get<ReasonCodeView[]>('/reason-codes'), staleTime: 5 * 60_000 });
  const names = new Map((reasons.data ?? []).map((r) => [r.code, currentLocale() === 'zh-CN' && r.nameZh ? r.nameZh : r.name]));
  const reasonName: ReasonName = (code) => names.get(code);
  if (items.length === 0) return <EmptyState title={t('empty.title')}>{t('empty.text')}</EmptyState>;
  return (
    <ul className="flex flex-col gap-3">
      {items.map((i) => (
        <ExceptionRow key={i.id} item={i} canDecide={canDecide} reasonName={reasonName} describe={describe} />
      ))}
    </ul>
  );
}
