import { useState } from 'react';
import { Trans, useTranslation } from 'react-i18next';
import type { TFunction } from 'i18next';
import { AlertTriangle, Flame, Layers, Split } from 'lucide-react';
import { FLOOR_LEADS } from '@shared/domain/access';
import type { LoadGroup, LoadView } from '@shared/schemas/loads';
import { queryClient } from '@/lib/query-client';
import { loadsQueryOptions, useCreateLoad, useLoads, useSplitLoad } from '@/features/loads/api/get-loads';
import { Button } from '@/components/ui/button';
import { Card, EmptyState, ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';
import { humanise } from '@/lib/labels';
import { currentLocale } from '@/lib/i18n';
import { minutesText } from '@/lib/duration';
import { errorText } from '@/lib/error-text';
import { cures, LOAD_KIND_TRAITS, type LoadKind } from '@shared/domain/traveller/station-kinds';

export const handle = { roles: FLOOR_LEADS };
export const loader = () => queryClient.ensureQueryData(loadsQueryOptions());

const num = (n: number) => n.toLocaleString(currentLocale());

/** A load group's name: the cure time, or the plating finish by its shared name. */
function groupName(kind: LoadKind, key: string, t: TFunction<'loads'>, tc: TFunction<'common'>): string {
  if (LOAD_KIND_TRAITS[kind].groupedBy === 'cure profile') return t('cureLabel', { minutes: key });
  return tc(`plating.${key as 'gold'}`, { defaultValue: humanise(key) });
}

function GroupCard({ kind, group }: { kind: LoadKind; group: LoadGroup }) {
  const create = useCreateLoad();
  const { t } = useTranslation('loads');
  const { t: tc } = useTranslation('common');
  const [chosen, setChosen] = useState<Set<string>>(() => new Set());
  const toggle = (id: string) =>
    setChosen((s) => {
      const n = new Set(s);
      if (n.has(id)) n.delete(id);
      else n.add(id);
      return n;
    });
  const pieces = group.trays.filter((tr) => chosen.has(tr.trayId)).reduce((s, tr) => s + tr.quantity, 0);
  const title = groupName(kind, group.key, t, tc);
  return (
    <Card>
      <header className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="text-xl font-bold text-harbour-900">{title}</h3>
        <span className="text-harbour-700">
          {t('groupSummary', { trays: group.trays.length, pieces: num(group.pieces), oldest: minutesText(group.oldestMinutes) })}
        </span>
      </header>
      <table className="w-full text-left text-sm" aria-label={t('traysWaiting', { title })}>
        <thead>
          <tr className="border-b-2 border-harbour-100">
            <th className="w-10 px-2 py-1">
              <span className="sr-only">{t('choose')}</span>
            </th>
            <th className="px-2 py-1">{t('tray')}</th>
            <th className="px-2 py-1">{t('order')}</th>
            <th className="px-2 py-1">{t('customer')}</th>
            <th className="px-2 py-1 text-right">{t('pieces')}</th>
            <th className="px-2 py-1 text-right">{t('waiting')}</th>
          </tr>
        </thead>
        <tbody>
          {group.trays.map((tr) => (
            <tr key={tr.trayId} className="border-b border-harbour-50">
              <td className="px-2 py-1">
                <input
                  type="checkbox"
                  className="h-6 w-6"
                  checked={chosen.has(tr.trayId)}
                  onChange={() => toggle(tr.trayId)}
                  aria-label={t('putIn', { number: tr.number })}
                />
              </td>
              <td className="px-2 py-1 font-bold">{tr.number}</td>
              <td className="px-2 py-1">{tr.orderNumber}</td>
              <td className="px-2 py-1">{tr.customer}</td>
              <td className="px-2 py-1 text-right tabular-nums">{num(tr.quantity)}</td>
              <td className="px-2 py-1 text-right">{minutesText(tr.waitingMinutes)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <div className="mt-3 flex flex-wrap items-center gap-3">
        <Button
          disabled={chosen.size === 0 || create.isPending}
          onClick={() => create.mutate({ kind, trayIds: [...chosen] }, { onSuccess: () => setChosen(new Set()) })}
        >
          <Layers className="h-5 w-5" aria-hidden /> {t(cures(kind) ? 'makeCure' : 'makePlate', { count: chosen.size, pieces: num(pieces) })}
        </Button>
        {create.error && <span className="font-bold text-stop-700">{errorText(create.error)}</span>}
      </div>
    </Card>
  );
}

function OpenLoad({ load }: { load: LoadView }) {
  const split = useSplitLoad();
  const { t } = useTranslation('loads');
  const { t: tc } = useTranslation('common');
  return (
    <Card>
      <header className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="text-xl font-bold text-harbour-900">
          {load.number} · {groupName(load.kind, load.groupKey, t, tc)}
        </h3>
        <Pill tone="info">{t('loadPieces', { pieces: num(load.pieces) })}</Pill>
      </header>
      <p className="mb-2 text-sm text-harbour-700">{t('keepsOwn')}</p>
      <ul className="mb-3 flex flex-col gap-1">
        {load.orders.map((o) => (
          <li key={o.orderId}>
            <Trans
              t={t}
              i18nKey="orderLine"
              values={{
                number: o.orderNumber,
                pieces: num(o.pieces),
                trays: load.trays
                  .filter((tr) => tr.orderId === o.orderId)
                  .map((tr) => tr.number)
                  .join(', '),
              }}
              components={{ strong: <strong /> }}
            />
          </li>
        ))}
      </ul>
      <Button variant="secondary" disabled={split.isPending} onClick={() => split.mutate(load.id)}>
        <Split className="h-5 w-5" aria-hidden /> {t('split')}
      </Button>
      {split.error && <p className="mt-2 font-bold text-stop-700">{errorText(split.error)}</p>}
    </Card>
  );
}

export function Component() {
  const loads = useLoads();
  const { t } = useTranslation('loads');
  return (
    <>
      <PageHeader title={t('title')} subtitle={t('subtitle')} />
      <p className="mb-4 flex items-start gap-2 rounded-xl border-2 border-warn-700/30 bg-warn-50 p-3 text-warn-700">
        <AlertTriangle className="mt-0.5 h-5 w-5 shrink-0" aria-hidden />
        {t('safety')}
      </p>
      {loads.isPending ? (
        <Loading />
      ) : loads.error ? (
        <ErrorPanel message={errorText(loads.error)} />
      ) : (
        <div className="flex flex-col gap-6">
          {loads.data.open.length > 0 && (
            <section aria-label={t('open')} className="flex flex-col gap-3">
              <h2 className="text-2xl font-bold text-harbour-900">{t('open')}</h2>
              {loads.data.open.map((l) => (
                <OpenLoad key={l.id} load={l} />
              ))}
            </section>
          )}
          <section aria-label={t('waitingOven')} className="flex flex-col gap-3">
            <h2 className="flex items-center gap-2 text-2xl font-bold text-harbour-900">
              <Flame className="h-6 w-6" aria-hidden /> {t('waitingOven')}
            </h2>
            {loads.data.oven.length === 0 ? <EmptyState title={t('noOven')} /> : loads.data.oven.map((g) => <GroupCard key={g.key} kind="cure" group={g} />)}
          </section>
          <section aria-label={t('waitingPlating')} className="flex flex-col gap-3">
            <h2 className="flex items-center gap-2 text-2xl font-bold text-harbour-900">
              <Layers className="h-6 w-6" aria-hidden /> {t('waitingPlating')}
            </h2>
            {loads.data.plating.length === 0 ? (
              <EmptyState title={t('noPlating')} />
            ) : (
              loads.data.plating.map((g) => <GroupCard key={g.key} kind="plate" group={g} />)
            )}
          </section>
        </div>
      )}
    </>
  );
}
