import { useState } from 'react';
import { Copy, ExternalLink, Link2, Link2Off } from 'lucide-react';
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
  const create = useCreateShareLink(orderId);
  const revoke = useRevokeShareLinks(orderId);
  const [copied, setCopied] = useState(false);
  const live = links.filter((l) => !l.revokedAt);
  const url = create.data?.url;
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm text-harbour-700">
        The customer sees the title, the customer name, the stage, the projected ship date and, once shipped, the carrier and tracking number. Nothing else.
      </p>
      <div className="flex flex-wrap gap-2">
        <Button onClick={() => (setCopied(false), create.mutate())} disabled={disabled || create.isPending}>
          <Link2 className="h-5 w-5" aria-hidden /> Make a status link
        </Button>
        <Button
          variant="danger"
          disabled={live.length === 0 || revoke.isPending}
          onClick={() => {
            if (window.confirm(`Withdraw ${live.length} live ${live.length === 1 ? 'link' : 'links'}? Anyone opening ${live.length === 1 ? 'it' : 'them'} will see that the link no longer works.`)) {
              create.reset();
              revoke.mutate();
            }
          }}
        >
          <Link2Off className="h-5 w-5" aria-hidden /> Withdraw all links
        </Button>
      </div>
      {create.error && <ErrorPanel message={create.error.message} />}
      {revoke.error && <ErrorPanel message={revoke.error.message} />}
      {url && (
        <div className="rounded-lg border-2 border-brass-400 bg-brass-300/20 p-3">
          {/^https?:\/\/(localhost|127\.|\[::1\])/i.test(url) && (
            <p role="alert" className="mb-2 font-bold text-stop-700">
              This link points at localhost: the customer cannot open it. Ask an administrator to set TRAYCE_PUBLIC_URL to the factory&rsquo;s public address, then make a new link.
            </p>
          )}
          <label className="flex flex-col gap-1 text-sm font-bold">
            New status link (copy it now; it is not shown again)
            <input readOnly value={url} onFocus={(e) => e.currentTarget.select()} className="min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-2 font-mono text-sm font-normal" aria-label="Status link" />
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
              <Copy className="h-5 w-5" aria-hidden /> {copied ? 'Copied' : 'Copy'}
            </Button>
            <a className="inline-flex min-h-11 items-center gap-2 rounded-lg px-4 font-bold text-harbour-800 hover:bg-harbour-50" href={url} target="_blank" rel="noreferrer noopener">
              <ExternalLink className="h-5 w-5" aria-hidden /> Open as the customer sees it
            </a>
          </div>
        </div>
      )}
      {links.length > 0 && (
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Status links of this order</caption>
          <thead>
            <tr className="text-harbour-700">
              <th scope="col" className="py-1 pr-2">Made</th>
              <th scope="col" className="py-1 pr-2">For</th>
              <th scope="col" className="py-1 pr-2">Last opened</th>
              <th scope="col" className="py-1">State</th>
            </tr>
          </thead>
          <tbody>
            {links.map((l) => (
              <tr key={l.id} className="border-t border-harbour-100">
                <td className="py-1 pr-2">
                  {when(l.createdAt)}
                  {l.createdBy ? ` · ${l.createdBy}` : ''}
                </td>
                <td className="py-1 pr-2">{l.purpose === 'shipped_mail' ? 'Shipped mail' : l.purpose === 'quote_accepted' ? 'Accepted quote' : 'Customer'}</td>
                <td className="py-1 pr-2">{when(l.lastOpenedAt)}</td>
                <td className="py-1 font-bold">{l.revokedAt ? `Withdrawn ${when(l.revokedAt)}` : 'Live'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}
