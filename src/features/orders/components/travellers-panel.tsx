import { useState, type ReactNode } from 'react';
import { Link } from 'react-router';
import { useTranslation } from 'react-i18next';
import { Printer } from 'lucide-react';
import type { OrderDetail, TravellerSummary } from '@shared/schemas/orders';
import { TRAVELLER_LAYOUT_VALUES, type TravellerLayoutValue } from '@shared/schemas/travellers';
import { Card, Pill } from '@/components/ui/panels';
import { SelectField } from '@/components/ui/field';
import { paths } from '@/config/paths';
import { travellersPdfUrl } from '../api/release-order';

const linkButton = 'inline-flex min-h-11 items-center justify-center gap-2 rounded-lg px-4 font-bold';

function Row({ t, checked, onCheck, actions }: { t: TravellerSummary; checked: boolean; onCheck: (v: boolean) => void; actions?: ReactNode }) {
  const { t: tr } = useTranslation(['orders', 'common']);
  const merged = t.phase === 'merged';
  return (
    <tr className="border-t border-harbour-100">
      <td className="px-2 py-1">
        <input
          type="checkbox"
          className="h-6 w-6 accent-harbour-800"
          aria-label={tr('travellers.choose', { number: t.number })}
          checked={checked}
          disabled={merged}
          onChange={(e) => onCheck(e.target.checked)}
        />
      </td>
      <td className="px-2 py-1 font-bold">
        <Link className="text-harbour-800 underline" to={paths.tray(t.id)}>
          {t.number}
        </Link>
      </td>
      <td className="px-2 py-1">{t.kind === 'mould' ? '—' : t.quantity}</td>
      <td className="px-2 py-1">{t.stepName ?? (t.phase === 'done' ? tr('travellers.allDone') : '—')}</td>
      <td className="px-2 py-1">
        <Pill tone={t.onHold ? 'stop' : t.phase === 'done' ? 'ok' : 'neutral'}>{tr(`common:phase.${t.onHold ? 'on_hold' : t.phase}`)}</Pill>
      </td>
      <td className="px-2 py-1">{t.revision}</td>
      <td className="px-2 py-1">{actions}</td>
    </tr>
  );
}

/** The order's travellers after release: print all, or a chosen few, in the layout the planner picks. */
export function TravellersPanel({ order, actions }: { order: OrderDetail; actions?: (t: TravellerSummary) => ReactNode }) {
  const { t } = useTranslation('orders');
  const [layout, setLayout] = useState<TravellerLayoutValue>('a6');
  const [chosen, setChosen] = useState<Set<string>>(new Set());
  const all = [...order.moulds, ...order.trays];
  const toggle = (id: string, v: boolean) => {
    const next = new Set(chosen);
    if (v) next.add(id);
    else next.delete(id);
    setChosen(next);
  };
  const live = all.filter((x) => x.phase !== 'merged');
  return (
    <Card>
      <div className="mb-4 flex flex-wrap items-end justify-between gap-4">
        <div>
          <h2 className="text-xl font-bold text-harbour-900">{t('travellers.title')}</h2>
          <p className="text-sm text-harbour-700">
            {t('travellers.intro', { trays: order.trays.filter((x) => x.phase !== 'merged').length, count: order.moulds.length })}
          </p>
        </div>
        <div className="flex flex-wrap items-end gap-3">
          <SelectField label={t('travellers.layout')} value={layout} onChange={(e) => setLayout(e.target.value as TravellerLayoutValue)}>
            {TRAVELLER_LAYOUT_VALUES.map((l) => (
              <option key={l} value={l}>
                {t(`travellers.layouts.${l}`)}
              </option>
            ))}
          </SelectField>
          <a className={`${linkButton} bg-harbour-800 text-white hover:bg-harbour-700`} href={travellersPdfUrl(order.id, layout)} download>
            <Printer className="h-5 w-5" aria-hidden /> {t('travellers.printAll', { count: live.length })}
          </a>
          {chosen.size > 0 && (
            <a
              className={`${linkButton} border-2 border-harbour-800 bg-white text-harbour-800`}
              href={travellersPdfUrl(order.id, layout, [...chosen])}
              download
            >
              <Printer className="h-5 w-5" aria-hidden /> {t('travellers.printChosen', { count: chosen.size })}
            </a>
          )}
        </div>
      </div>
      <div className="overflow-x-auto">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">{t('travellers.caption', { number: order.number })}</caption>
          <thead className="bg-harbour-50">
            <tr>
              <th scope="col" className="px-2 py-2">
                <input
                  type="checkbox"
                  className="h-6 w-6 accent-harbour-800"
                  aria-label={t('travellers.chooseAll')}
                  checked={chosen.size > 0 && chosen.size === live.length}
                  onChange={(e) => setChosen(e.target.checked ? new Set(live.map((x) => x.id)) : new Set())}
                />
              </th>
              <th scope="col" className="px-2 py-2">
                {t('travellers.col.number')}
              </th>
              <th scope="col" className="px-2 py-2">
                {t('travellers.col.pieces')}
              </th>
              <th scope="col" className="px-2 py-2">
                {t('travellers.col.next')}
              </th>
              <th scope="col" className="px-2 py-2">
                {t('travellers.col.state')}
              </th>
              <th scope="col" className="px-2 py-2">
                {t('travellers.col.revision')}
              </th>
              <th scope="col" className="px-2 py-2">
                <span className="sr-only">{t('travellers.col.actions')}</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {order.moulds.map((m) => (
              <Row
                key={m.id}
                t={{
                  ...m,
                  stepName: m.stepName
                    ? t('travellers.mouldStep', { side: t(`travellers.side.${m.side}`), step: m.stepName })
                    : t('travellers.mouldDone', { side: t(`travellers.side.${m.side}`) }),
                }}
                checked={chosen.has(m.id)}
                onCheck={(v) => toggle(m.id, v)}
                actions={actions?.(m)}
              />
            ))}
            {order.trays.map((x) => (
              <Row key={x.id} t={x} checked={chosen.has(x.id)} onCheck={(v) => toggle(x.id, v)} actions={actions?.(x)} />
            ))}
          </tbody>
        </table>
      </div>
    </Card>
  );
}
