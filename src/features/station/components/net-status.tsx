import { useTranslation } from 'react-i18next';
import { CloudOff, RefreshCw, Wifi } from 'lucide-react';
import type { SyncStatus } from '../lib/sync-engine';
import { formatClock } from '../lib/format';
import type { StationLang } from '../lib/refusal-text';

/** Always on screen: online or not, and how many scans wait (words and icon, never colour alone). */
export function NetStatus({ status, lang }: { status: SyncStatus; lang: StationLang }) {
  const { t } = useTranslation('station');
  const waiting = !status.ready ? t('app.loading') : status.pending > 0 ? t('net.waiting', { count: status.pending }) : t('net.allSent');
  return (
    <div
      role="status"
      aria-live="polite"
      data-testid="net-status"
      data-online={status.online ? 'yes' : 'no'}
      data-pending={status.ready ? status.pending : undefined}
      className={`flex min-h-12 items-center gap-3 rounded-xl px-3 py-1 font-bold ${status.online ? 'bg-ok-50 text-ok-700' : 'bg-warn-50 text-warn-700'}`}
    >
      {status.online ? <Wifi className="h-6 w-6" aria-hidden /> : <CloudOff className="h-6 w-6" aria-hidden />}
      <span>{status.online ? t('net.online') : t('net.offline')}</span>
      <span aria-hidden>·</span>
      <span data-testid="pending-count">{waiting}</span>
      {status.photosPending > 0 && <span className="font-normal">· {t('net.photosWaiting', { count: status.photosPending })}</span>}
      {status.sending && <RefreshCw className="h-5 w-5 animate-spin" aria-label={t('net.sending')} />}
      {!status.sending && status.nextRetryAt && status.pending > 0 && (
        <span className="text-sm font-normal">{t('net.retryAt', { time: formatClock(lang, new Date(status.nextRetryAt).toISOString()) })}</span>
      )}
    </div>
  );
}
