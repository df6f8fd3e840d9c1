import { useState } from 'react';
import { Copy, ExternalLink, Link2, Link2Off } from 'lucide-react';
import { useTranslation } from 'react-i18next';
import { errorText } from '@/lib/error-text';
import type { ShareLinkInfo } from '@shared/schemas/shipping';
import { Button } from '@/components/ui/button';
import { ErrorPanel } from '@/components/ui/panels';
import { useCreateShareLink, useRevokeShareLinks } from '../api/share-link';
import { formatDateTime } from '@/lib/datetime';

const when = (iso: string | null) => formatDateTime(iso);

/**
 * Sales makes a read-only status link for the customer. The address is shown once, right after
 * it is made: the server keeps only a fingerprint of it, so it cannot be shown again.
 */
export function ShareLinkPanel({ orderId, links, disabled }: { orderId: string; links: ShareLinkInfo[]; disabled?: boolean }) {
  const { t } = useTranslation('sales');
  const create = useCreateShareLink(orderId);
  const revoke = useRevokeShareLinks(orderId);
  const [copied, setCopied] = useState(false);
  const live = links.filter((l) => !l.revokedAt);
  const url = create.data?.url;
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm text-harbour-700">{t('link.explain')}</p>
      <div className="flex flex-wrap gap-2">
        <Button onClick={() => (setCopied(false), create.mutate())} disabled={disabled || create.isPending}>
          <Link2 className="h-5 w-5" aria-hidden /> {t('link.make')}
        </Button>
        <Button
          variant="danger"
          disabled={live.length === 0 || revoke.isPending}
          onClick={() => {
            if (window.confirm(live.length === 1 ? t('link.confirmOne') : t('link.confirmMany', { count: live.length }))) {
              create.reset();
              revoke.mutate();
            }
          }}
        >
          <Link2Off className="h-5 w-5" aria-hidden /> {t('link.withdrawAll')}
        </Button>
      </div>
      {create.error && <ErrorPanel message={errorText(create.error)} />}
      {revoke.error && <ErrorPanel message={errorText(revoke.error)} />}
      {url && (
        <div className="rounded-lg border-2 border-brass-400 bg-brass-300/20 p-3">
          {/^https?:\/\/(localhost|127\.|\[::1\])/i.test(url) && (
            <p role="alert" className="mb-2 font-bold text-stop-700">
              {t('link.localhost')}
            </p>
          )}
          <label className="flex flex-col gap-1 text-sm font-bold">
            {t('link.newLink')}
            <input
              readOnly
              value={url}
              onFocus={(e) => e.currentTarget.select()}
              className="min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-2 font-mono text-sm font-normal"
              aria-label={t('link.linkLabel')}
            />
          </label>
          <div className="mt-2 flex flex-wrap gap-2">
            <Button
              variant="secondary"
              onClick={() =>
                navigator.clipboard?.writeText(url).then(
                  () => setCopied(true),
                  () => setCopied(false),
                )
              }
            >
              <Copy className="h-5 w-5" aria-hidden /> {copied ? t('link.copied') : t('link.copy')}
            </Button>
            <a
              className="inline-flex min-h-11 items-center gap-2 rounded-lg px-4 font-bold text-harbour-800 hover:bg-harbour-50"
              href={url}
              target="_blank"
              rel="noreferrer noopener"
            >
              <ExternalLink className="h-5 w-5" aria-hidden /> {t('link.open')}
            </a>
          </div>
        </div>
      )}
      {links.length > 0 && (
        <table className="w-full text-left text-sm">
          <caption className="sr-only">{t('link.caption')}</caption>
          <thead>
            <tr className="text-harbour-700">
              <th scope="col" className="py-1 pr-2">
                {t('link.made')}
              </th>
              <th scope="col" className="py-1 pr-2">
                {t('link.for')}
              </th>
              <th scope="col" className="py-1 pr-2">
                {t('link.lastOpened')}
              </th>
              <th scope="col" className="py-1">
                {t('link.state')}
              </th>
            </tr>
          </thead>
          <tbody>
            {links.map((l) => (
              <tr key={l.id} className="border-t border-harbour-100">
                <td className="py-1 pr-2">
                  {when(l.createdAt)}
                  {l.createdBy ? ` · ${l.createdBy}` : ''}
                </td>
                <td className="py-1 pr-2">
                  {l.purpose === 'shipped_mail'
                    ? t('link.purpose_shipped_mail')
                    : l.purpose === 'quote_accepted'
                      ? t('link.purpose_quote_accepted')
                      : t('link.purpose_customer')}
                </td>
                <td className="py-1 pr-2">{when(l.lastOpenedAt)}</td>
                <td className="py-1 font-bold">{l.revokedAt ? t('link.withdrawn', { date: when(l.revokedAt) }) : t('link.live')}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}
