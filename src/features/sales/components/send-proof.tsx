import { useState } from 'react';
import { Send } from 'lucide-react';
import { useTranslation } from 'react-i18next';
import { errorText } from '@/lib/error-text';
import type { SalesOrderDetail } from '@shared/schemas/shipping';
import { Button } from '@/components/ui/button';
import { ErrorPanel } from '@/components/ui/panels';
import { useSendProof } from '../api/set-contact';

/** Mails a proof revision to the customer contact for approval, with the proof attached. */
export function SendProof({ order }: { order: SalesOrderDetail }) {
  const { t } = useTranslation('sales');
  const send = useSendProof(order.id);
  const latest = order.proofs.at(-1)?.revision;
  const [revision, setRevision] = useState<number | undefined>(latest);
  if (order.proofs.length === 0) return <p className="text-harbour-700">{t('proof.none')}</p>;
  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-end gap-2">
        <label className="flex flex-col gap-1 text-sm font-bold">
          {t('proof.revision')}
          <select
            className="min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-2"
            value={revision}
            onChange={(e) => setRevision(Number(e.target.value))}
          >
            {order.proofs.map((p) => (
              <option key={p.revision} value={p.revision}>
                {p.revision}
                {p.approvedAt ? t('proof.approved') : ''}
              </option>
            ))}
          </select>
        </label>
        <Button variant="secondary" disabled={!revision || !order.contact.contactEmail || send.isPending} onClick={() => revision && send.mutate(revision)}>
          <Send className="h-5 w-5" aria-hidden /> {t('proof.send')}
        </Button>
      </div>
      {!order.contact.contactEmail && <p className="text-sm text-warn-700">{t('proof.needEmail')}</p>}
      {send.isSuccess && (
        <p role="status" className="font-bold text-ok-700">
          {t('proof.queued', { to: send.data.to })}
        </p>
      )}
      {send.error && <ErrorPanel message={errorText(send.error)} />}
    </div>
  );
}
