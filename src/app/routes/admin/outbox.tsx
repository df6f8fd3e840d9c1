import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { Mail, RotateCw } from 'lucide-react';
import { ADMIN_ONLY } from '@shared/domain/access';
import type { CaughtMail } from '@shared/schemas/shipping';
import { queryClient } from '@/lib/query-client';
import { caughtMailQueryOptions, useCaughtMail, useMailQueue, useQueueLateDigest, useRetryMail } from '@/features/mail/api/get-mail';
import { Button } from '@/components/ui/button';
import { Card, EmptyState, ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';
import { formatDateTime } from '@/lib/datetime';

export const handle = { roles: ADMIN_ONLY };
export const loader = () => queryClient.ensureQueryData(caughtMailQueryOptions());

const when = (iso: string) => formatDateTime(iso);

function Message({ m }: { m: CaughtMail }) {
  const { t } = useTranslation('admin');
  const [open, setOpen] = useState(false);
  return (
    <li className="border-t border-harbour-100 py-2 first:border-t-0">
      <button type="button" className="flex min-h-11 w-full flex-wrap items-baseline gap-x-3 text-left" aria-expanded={open} onClick={() => setOpen((x) => !x)}>
        <span className="font-bold">{m.subject}</span>
        <span className="text-sm text-harbour-700">{t('outbox.to', { to: m.to })}</span>
        <span className="ml-auto text-sm text-harbour-700">{when(m.sentAt)}</span>
      </button>
      {open && (
        <div className="mt-2 rounded-lg bg-harbour-50 p-3">
          <pre className="whitespace-pre-wrap break-words font-sans text-sm">{m.text}</pre>
          {m.attachments && m.attachments.length > 0 && (
            <p className="mt-2 text-sm">
              {t('outbox.attached', { files: m.attachments.map((a) => `${a.filename} (${Math.round(a.size / 1024)} KB)`).join(', ') })}
            </p>
          )}
        </div>
      )}
    </li>
  );
}

export function Component() {
  const { t } = useTranslation('admin');
  const caught = useCaughtMail();
  const queue = useMailQueue();
  const retry = useRetryMail();
  const digest = useQueueLateDigest();
  const waiting = queue.data?.filter((q) => q.status !== 'sent') ?? [];
  return (
    <>
      <PageHeader
        title={t('outbox.title')}
        subtitle={t('outbox.subtitle', { setting: 'SMTP_URL' })}
        actions={
          <Button variant="secondary" onClick={() => digest.mutate()} disabled={digest.isPending}>
            {t('outbox.digest')}
          </Button>
        }
      />
      {digest.data && (
        <p role="status" className="mb-4 font-bold text-ok-700">
          {digest.data.orders === 0
            ? t('outbox.noDigest')
            : t('outbox.queued', { queued: digest.data.queued, date: digest.data.date, orders: digest.data.orders })}
        </p>
      )}
      {waiting.length > 0 && (
        <Card className="mb-6">
          <h2 className="mb-2 text-xl font-bold">{t('outbox.waitingTitle')}</h2>
          <ul>
            {waiting.map((q) => (
              <li key={q.id} className="flex flex-wrap items-center gap-3 border-t border-harbour-100 py-2 first:border-t-0">
                {q.status === 'failed' ? <Pill tone="stop">{t('outbox.failed')}</Pill> : <Pill tone="warn">{t('outbox.queuedPill')}</Pill>}
                <span className="font-bold">{q.subject}</span>
                <span className="text-sm text-harbour-700">{t('outbox.to', { to: q.to })}</span>
                <span className="text-sm text-harbour-700">
                  {t('outbox.attempts', { count: q.attempts })}
                  {q.lastError ? `: ${q.lastError}` : ''}
                </span>
                {q.status === 'failed' && (
                  <Button variant="ghost" onClick={() => retry.mutate(q.id)}>
                    <RotateCw className="h-5 w-5" aria-hidden /> {t('outbox.sendAgain')}
                  </Button>
                )}
              </li>
            ))}
          </ul>
        </Card>
      )}
      <Card>
        <h2 className="mb-2 flex items-center gap-2 text-xl font-bold">
          <Mail className="h-6 w-6" aria-hidden /> {t('outbox.caught')}
        </h2>
        {caught.isPending ? (
          <Loading />
        ) : caught.error ? (
          <ErrorPanel message={caught.error.message} />
        ) : caught.data.length === 0 ? (
          <EmptyState title={t('outbox.noMail')}>{t('outbox.noMailHint')}</EmptyState>
        ) : (
          <ul aria-label={t('outbox.caught')}>
            {caught.data.map((m) => (
              <Message key={m.id ?? `${m.sentAt}-${m.to}`} m={m} />
            ))}
          </ul>
        )}
      </Card>
    </>
  );
}
