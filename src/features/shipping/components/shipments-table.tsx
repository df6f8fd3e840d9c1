import { FileText } from 'lucide-react';
import { useTranslation } from 'react-i18next';
import { currentLocale } from '@/lib/i18n';
import type { ShipmentView } from '@shared/schemas/shipping';
import { Pill } from '@/components/ui/panels';
import { packingListUrl } from '../api/create-shipment';
import { formatDateTime } from '@/lib/datetime';

const when = (iso: string) => formatDateTime(iso);

export function ShipmentsTable({ orderId, shipments }: { orderId: string; shipments: ShipmentView[] }) {
  const { t } = useTranslation('shipping');
  if (shipments.length === 0) return <p className="text-harbour-700">{t('table.none')}</p>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">{t('table.caption')}</caption>
        <thead>
          <tr className="text-harbour-700">
            <th scope="col" className="py-2 pr-3">
              #
            </th>
            <th scope="col" className="py-2 pr-3">
              {t('table.carrierTracking')}
            </th>
            <th scope="col" className="py-2 pr-3 text-right">
              {t('table.cartons')}
            </th>
            <th scope="col" className="py-2 pr-3 text-right">
              {t('table.pieces')}
            </th>
            <th scope="col" className="py-2 pr-3 text-right">
              {t('table.weight')}
            </th>
            <th scope="col" className="py-2 pr-3">
              {t('table.recorded')}
            </th>
            <th scope="col" className="py-2">
              {t('table.packingList')}
            </th>
          </tr>
        </thead>
        <tbody>
          {shipments.map((s) => (
            <tr key={s.id} className="border-t border-harbour-100 align-top">
              <td className="py-2 pr-3 font-bold">{s.number}</td>
              <td className="py-2 pr-3">
                {s.carrier}
                <br />
                <span className="font-mono text-base font-bold">{s.trackingNumber}</span>
                {s.sharedWith.length > 0 && (
                  <span className="mt-1 block">
                    <Pill tone="warn">{t('table.alsoOn', { orders: s.sharedWith.join(', ') })}</Pill>
                  </span>
                )}
                {s.shortAccepted && (
                  <span className="mt-1 block">
                    <Pill tone="warn">{t('table.shortByDecision')}</Pill>
                  </span>
                )}
              </td>
              <td className="py-2 pr-3 text-right">{s.cartonCount}</td>
              <td className="py-2 pr-3 text-right">{s.pieces}</td>
              <td className="py-2 pr-3 text-right">{s.weightKg.toLocaleString(currentLocale(), { maximumFractionDigits: 3 })} kg</td>
              <td className="py-2 pr-3">
                {when(s.shippedAt)}
                {s.createdBy ? ` · ${s.createdBy}` : ''}
              </td>
              <td className="py-2">
                <a
                  className="inline-flex min-h-11 items-center gap-1 font-bold text-harbour-700 underline"
                  href={packingListUrl(orderId, s.id)}
                  target="_blank"
                  rel="noreferrer"
                >
                  <FileText className="h-5 w-5" aria-hidden /> PDF
                </a>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
