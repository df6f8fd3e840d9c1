import type { ReactNode } from 'react';
import { AlertTriangle } from 'lucide-react';
import { useTranslation } from 'react-i18next';
import type { HistoryEntry, OrderDetail } from '@shared/schemas/orders';
import { Card } from '@/components/ui/panels';
import { formatDateTime, formatDueDay } from '@/lib/labels';
import { useProjectionNote } from '@/lib/projection-note';
import { useHistoryLine } from '../history-line';

/** A colour swatch with its name: the word carries the meaning, the colour helps. */
export function Swatch({ name, hex, refCode }: { name: string; hex?: string; refCode?: string }) {
  return (
    <span className="inline-flex items-center gap-2 rounded-full border border-harbour-100 bg-white py-1 pr-3 pl-1">
      <span
        aria-hidden
        className="h-6 w-6 rounded-full border border-ink/30"
        style={hex ? { background: hex } : { background: 'repeating-linear-gradient(45deg,#fff,#fff 3px,#d5e6e6 3px,#d5e6e6 6px)' }}
      />
      <span className="font-bold">{name}</span>
      {refCode && <span className="text-sm text-harbour-700">{refCode}</span>}
    </span>
  );
}

/** `projected`: shown under the projected ship date (the route adds the 85 % date and its measured coverage). */
export function SpecCard({ order, projected }: { order: OrderDetail; projected?: ReactNode }) {
  const { t, i18n } = useTranslation(['orders', 'common']);
  const projectionNote = useProjectionNote();
  const s = order.spec;
  const zh = i18n.language === 'zh-CN';
  // English writes a second name in lower case inside a sentence; Chinese has no case
  const lower = (x: string) => (zh ? x : x.toLowerCase());
  const plating = (p: string) => t(`common:plating.${p}` as 'common:plating.gold', { defaultValue: p });
  const extras = [
    s.backLogo && t('specCard.extra.backLogo'),
    s.printing && t('specCard.extra.printing'),
    s.epoxy && t('specCard.extra.epoxy'),
    s.sandblast && t('specCard.extra.sandblast'),
  ].filter(Boolean);
  const rows: [string, ReactNode][] = [
    [t('specCard.customer'), order.customer.name],
    [
      t('specCard.product'),
      `${t(`product.${s.productType}` as 'product.pin', { defaultValue: s.productType })} · ${t(`common:process.${s.process}` as 'common:process.printed', { defaultValue: s.process })} · ${t(`common:material.${s.material}` as 'common:material.iron', { defaultValue: s.material })} · ${s.sizeMm} mm`,
    ],
    [t('specCard.quantity'), t('specCard.quantityValue', { quantity: s.quantity, overrun: s.overrunPct, released: order.releasedQuantity })],
    [
      t('specCard.plating'),
      s.secondPlating ? t('specCard.twoTone', { first: plating(s.plating), second: lower(plating(s.secondPlating)) }) : plating(s.plating),
    ],
    [
      t('specCard.fittings'),
      s.backing.type === 'none' || s.backing.count === 0
        ? t('specCard.none')
        : `${s.backing.count} × ${lower(t(`common:backing.${s.backing.type}` as 'common:backing.none', { defaultValue: s.backing.type }))}`,
    ],
    [t('specCard.extras'), extras.join(zh ? '、' : ', ') || t('specCard.none')],
    [t('specCard.packaging'), t(`common:packaging.${s.packaging}` as 'common:packaging.bulk', { defaultValue: s.packaging })],
    [t('specCard.due'), formatDueDay(s.dueDate)],
    [
      t('specCard.projectedShip'),
      <>
        {order.projectedShipAt ? formatDateTime(order.projectedShipAt) : order.releasedAt ? '—' : t('specCard.afterRelease')}
        {order.projectedShipAt && projected}
      </>,
    ],
  ];
  if (order.reorderOf) rows.push([t('specCard.repeatOf'), t('specCard.repeatOrder', { number: order.reorderOf.number })]);
  return (
    <Card>
      <h2 className="mb-4 text-xl font-bold text-harbour-900">{t('specCard.title')}</h2>
      <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[10rem_1fr]">
        {rows.map(([k, v]) => (
          <div key={k} className="contents">
            <dt className="font-bold text-harbour-700">{k}</dt>
            <dd>{v}</dd>
          </div>
        ))}
        {order.projectionNote && order.projectedShipAt && (
          <>
            <dt className="font-bold text-harbour-700">{t('specCard.howProjected')}</dt>
            <dd className="text-sm text-harbour-700">{order.projectionNoteCode ? projectionNote(order.projectionNoteCode) : order.projectionNote}</dd>
          </>
        )}
        <dt className="font-bold text-harbour-700">{t('specCard.colours')}</dt>
        <dd className="flex flex-wrap gap-2">
          {s.colours.length === 0 ? t('specCard.none') : s.colours.map((c, i) => <Swatch key={i} name={`${i + 1}. ${c.name}`} hex={c.hex} refCode={c.ref} />)}
        </dd>
        {s.notes && (
          <>
            <dt className="font-bold text-harbour-700">{t('specCard.notes')}</dt>
            <dd className="whitespace-pre-wrap">{s.notes}</dd>
          </>
        )}
      </dl>
      {order.warnings.length > 0 && (
        <ul className="mt-4 flex flex-col gap-1" aria-label={t('specCard.warnings')}>
          {order.warnings.map((w) => (
            <li key={w.code} className="flex items-start gap-2 font-bold text-warn-700">
              <AlertTriangle className="mt-0.5 h-5 w-5 shrink-0" aria-hidden />{' '}
              {t(`form.warn.${w.code}` as 'form.warn.size_unusual', { ...w.params, defaultValue: w.message })}
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}

export function HistoryList({ entries }: { entries: HistoryEntry[] }) {
  const { t } = useTranslation('orders');
  const line = useHistoryLine();
  return (
    <Card>
      <h2 className="mb-4 text-xl font-bold text-harbour-900">{t('specCard.history')}</h2>
      <ol className="flex flex-col gap-2">
        {[...entries].reverse().map((h, i) => (
          <li key={i} className="flex flex-wrap gap-x-3 border-b border-harbour-50 pb-2">
            <time className="w-44 shrink-0 text-sm text-harbour-700" dateTime={h.at}>
              {formatDateTime(h.at)}
            </time>
            <span>
              {line(h)}
              {h.by && <span className="text-harbour-700"> · {h.by}</span>}
            </span>
          </li>
        ))}
      </ol>
    </Card>
  );
}
