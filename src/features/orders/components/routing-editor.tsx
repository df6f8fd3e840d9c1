import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { ArrowDown, ArrowUp, Plus, RotateCcw, Trash2 } from 'lucide-react';
import type { OrderDetail } from '@shared/schemas/orders';
import type { RoutingStepInput } from '@shared/schemas/routing';
import { routingProblems } from '@shared/domain/routing';
import { STATION_KINDS, type StationKind } from '@shared/domain/vocabulary';
import { Card, ErrorPanel } from '@/components/ui/panels';
import { Button } from '@/components/ui/button';
import { errorText } from '@/lib/error-text';
import { useEditRouting, useResetRouting } from '../api/routing';
import { cures } from '@shared/domain/traveller/station-kinds';

const cell = 'min-h-11 w-full rounded-lg border-2 border-harbour-100 bg-white px-2';

function toInput(order: OrderDetail): RoutingStepInput[] {
  return order.routing.map((s) => ({
    name: s.name,
    stationKind: s.stationKind,
    trayMinutes: s.trayMinutes,
    pieceMinutes: s.pieceMinutes,
    cureMinutes: s.cureMinutes ?? null,
    colour: s.colour ?? null,
  }));
}

/** The order's routing: a checklist after release; before release the planner may reorder, add, remove and retime steps. */
export function RoutingEditor({ order, canEdit }: { order: OrderDetail; canEdit: boolean }) {
  const { t, i18n } = useTranslation(['orders', 'common']);
  const kindName = (k: string) => t(`common:kind.${k}` as 'common:kind.fill', { defaultValue: k });
  const processName = t(`common:process.${order.spec.process}` as 'common:process.hard_enamel', { defaultValue: order.spec.process });
  // English writes the process in lower case inside the sentence ("the hard enamel template"), but not "3D"
  const processInSentence = i18n.language === 'en' && /^[A-Z][a-z]/.test(processName) ? processName.toLowerCase() : processName;
  const released = order.releasedAt != null;
  const [draft, setDraft] = useState<RoutingStepInput[] | null>(null);
  const edit = useEditRouting(order.id);
  const reset = useResetRouting(order.id);
  const steps = draft ?? toInput(order);
  const editing = draft !== null;
  const problems = routingProblems(steps.map((s, i) => ({ ...s, seq: i + 1 })));
  const traySize = order.traySize ?? Math.min(100, order.releasedQuantity);

  const change = (i: number, patch: Partial<RoutingStepInput>) => setDraft(steps.map((s, j) => (j === i ? { ...s, ...patch } : s)));
  const move = (i: number, by: -1 | 1) => {
    const next = [...steps];
    const [s] = next.splice(i, 1);
    next.splice(i + by, 0, s);
    setDraft(next);
  };

  return (
    <Card>
      <div className="mb-4 flex flex-wrap items-center justify-between gap-3">
        <div>
          <h2 className="text-xl font-bold text-harbour-900">{t('routing.title', { count: steps.length })}</h2>
          <p className="text-sm text-harbour-700">
            {t('routing.madeFrom', { process: processInSentence, size: traySize })}
            {released ? ` ${t('routing.fixed')}` : ''}
          </p>
        </div>
        {canEdit && !released && (
          <div className="flex flex-wrap gap-2">
            {editing ? (
              <>
                <Button disabled={edit.isPending || problems.length > 0} onClick={() => edit.mutate({ steps }, { onSuccess: () => setDraft(null) })}>
                  {t('routing.save')}
                </Button>
                <Button variant="secondary" onClick={() => setDraft(null)}>
                  {t('routing.discard')}
                </Button>
              </>
            ) : (
              <>
                <Button variant="secondary" onClick={() => setDraft(toInput(order))}>
                  {t('routing.edit')}
                </Button>
                <Button variant="ghost" disabled={reset.isPending} onClick={() => reset.mutate()}>
                  <RotateCcw className="h-5 w-5" aria-hidden /> {t('routing.remake')}
                </Button>
              </>
            )}
          </div>
        )}
      </div>
      <div className="overflow-x-auto">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">{t('routing.caption')}</caption>
          <thead className="bg-harbour-50">
            <tr>
              <th scope="col" className="px-2 py-2">
                #
              </th>
              <th scope="col" className="px-2 py-2">
                {t('routing.col.step')}
              </th>
              <th scope="col" className="px-2 py-2">
                {t('routing.col.kind')}
              </th>
              <th scope="col" className="px-2 py-2">
                {t('routing.col.trayMinutes')}
              </th>
              <th scope="col" className="px-2 py-2">
                {t('routing.col.pieceMinutes')}
              </th>
              <th scope="col" className="px-2 py-2">
                {t('routing.col.cure')}
              </th>
              {!editing && (
                <th scope="col" className="px-2 py-2">
                  {t('routing.col.standard', { size: traySize })}
                </th>
              )}
              {editing && (
                <th scope="col" className="px-2 py-2">
                  <span className="sr-only">{t('routing.col.actions')}</span>
                </th>
              )}
            </tr>
          </thead>
          <tbody>
            {steps.map((s, i) => (
              <tr key={i} className="border-t border-harbour-100">
                <td className="px-2 py-1 font-bold">{i + 1}</td>
                <td className="px-2 py-1">
                  {editing ? (
                    <input
                      aria-label={t('routing.stepName', { n: i + 1 })}
                      className={cell}
                      value={s.name}
                      onChange={(e) => change(i, { name: e.target.value })}
                    />
                  ) : (
                    s.name
                  )}
                </td>
                <td className="px-2 py-1">
                  {editing ? (
                    <select
                      aria-label={t('routing.stepKind', { n: i + 1 })}
                      className={cell}
                      value={s.stationKind}
                      onChange={(e) => {
                        const kind = e.target.value as StationKind;
                        change(i, { stationKind: kind, cureMinutes: cures(kind) ? (s.cureMinutes ?? 120) : null });
                      }}
                    >
                      {STATION_KINDS.map((k) => (
                        <option key={k} value={k}>
                          {kindName(k)}
                        </option>
                      ))}
                    </select>
                  ) : (
                    kindName(s.stationKind)
                  )}
                </td>
                <td className="px-2 py-1">
                  {editing ? (
                    <input
                      aria-label={t('routing.stepTrayMinutes', { n: i + 1 })}
                      type="number"
                      min={0}
                      step="0.5"
                      className={cell}
                      value={s.trayMinutes}
                      onChange={(e) => change(i, { trayMinutes: Number(e.target.value) })}
                    />
                  ) : (
                    s.trayMinutes
                  )}
                </td>
                <td className="px-2 py-1">
                  {editing ? (
                    <input
                      aria-label={t('routing.stepPieceMinutes', { n: i + 1 })}
                      type="number"
                      min={0}
                      step="0.01"
                      className={cell}
                      value={s.pieceMinutes}
                      onChange={(e) => change(i, { pieceMinutes: Number(e.target.value) })}
                    />
                  ) : (
                    s.pieceMinutes
                  )}
                </td>
                <td className="px-2 py-1">
                  {cures(s.stationKind) ? (
                    editing ? (
                      <input
                        aria-label={t('routing.stepCure', { n: i + 1 })}
                        type="number"
                        min={1}
                        className={cell}
                        value={s.cureMinutes ?? ''}
                        onChange={(e) => change(i, { cureMinutes: e.target.value === '' ? null : Math.round(Number(e.target.value)) })}
                      />
                    ) : (
                      s.cureMinutes
                    )
                  ) : (
                    '—'
                  )}
                </td>
                {!editing && <td className="px-2 py-1">{order.routing[i]?.standardMinutes}</td>}
                {editing && (
                  <td className="whitespace-nowrap px-2 py-1">
                    <Button variant="ghost" aria-label={t('routing.moveUp', { n: i + 1 })} disabled={i === 0} onClick={() => move(i, -1)}>
                      <ArrowUp className="h-5 w-5" aria-hidden />
                    </Button>
                    <Button variant="ghost" aria-label={t('routing.moveDown', { n: i + 1 })} disabled={i === steps.length - 1} onClick={() => move(i, 1)}>
                      <ArrowDown className="h-5 w-5" aria-hidden />
                    </Button>
                    <Button variant="ghost" aria-label={t('routing.remove', { n: i + 1 })} onClick={() => setDraft(steps.filter((_, j) => j !== i))}>
                      <Trash2 className="h-5 w-5" aria-hidden />
                    </Button>
                  </td>
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {editing && (
        <div className="mt-3 flex flex-col gap-3">
          <div>
            <Button
              variant="secondary"
              onClick={() =>
                setDraft([...steps, { name: t('routing.newStep'), stationKind: 'inspect', trayMinutes: 5, pieceMinutes: 0, cureMinutes: null, colour: null }])
              }
            >
              <Plus className="h-5 w-5" aria-hidden /> {t('routing.add')}
            </Button>
          </div>
          {problems.length > 0 && (
            <ul role="alert" className="list-disc pl-6 text-sm font-bold text-stop-700">
              {problems.map((p, i) => (
                <li key={i}>{t(`routing.problem.${p.code}`, { ...p.params })}</li>
              ))}
            </ul>
          )}
        </div>
      )}
      {(edit.error || reset.error) && <ErrorPanel title={t('routing.notSaved')} message={errorText(edit.error ?? reset.error)} />}
    </Card>
  );
}
