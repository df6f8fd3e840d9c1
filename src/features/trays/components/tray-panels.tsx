import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { Link } from 'react-router';
import { CheckSquare, GitBranch, GitMerge, Plus, Square, SquareArrowRight, Trash2 } from 'lucide-react';
import type { TrayView } from '@shared/schemas/trays';
import { Card, ErrorPanel, Pill } from '@/components/ui/panels';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { paths } from '@/config/paths';
import { formatDateTime, humanise } from '@/lib/labels';
import { useMergeTrays, useSplitTray } from '../api/tray-actions';
import { cures } from '@shared/domain/traveller/station-kinds';

/** A kind of station by the name the tablets use, in the reader's language. */
export function useKindName() {
  const { t } = useTranslation('common');
  return (k: string) => t(`kind.${k}` as 'kind.fill', { defaultValue: humanise(k) });
}

/** The routing as a checklist: done, current, to do. */
export function RoutingProgress({ tray }: { tray: TrayView }) {
  const { t } = useTranslation('trays');
  const current = tray.nextStep?.seq ?? null;
  const finished = tray.phase === 'done';
  return (
    <Card>
      <h2 className="mb-4 text-xl font-bold text-harbour-900">{t('routing.title')}</h2>
      <ol className="grid gap-1 md:grid-cols-2">
        {tray.routing.map((s) => {
          const done = finished || (current != null && s.seq < current);
          const here = s.seq === current;
          return (
            <li
              key={s.seq}
              className={`flex items-center gap-2 rounded-lg px-2 py-1 ${here ? 'bg-brass-300/40 font-bold' : ''}`}
              aria-current={here ? 'step' : undefined}
            >
              {done ? (
                <CheckSquare className="h-5 w-5 text-ok-700" aria-label={t('routing.done')} />
              ) : here ? (
                <SquareArrowRight className="h-5 w-5 text-harbour-800" aria-label={t('routing.current')} />
              ) : (
                <Square className="h-5 w-5 text-harbour-600" aria-label={t('routing.toDo')} />
              )}
              <span>
                {s.seq}. {s.name}
                {cures(s.stationKind) && s.cureMinutes ? (
                  <span className="text-sm text-harbour-700"> · {t('routing.atLeast', { minutes: s.cureMinutes })}</span>
                ) : null}
              </span>
            </li>
          );
        })}
      </ol>
    </Card>
  );
}

export function Genealogy({ tray }: { tray: TrayView }) {
  const { t } = useTranslation('trays');
  const empty = !tray.parent && tray.children.length === 0 && !tray.mergedInto && tray.mergedFrom.length === 0;
  const item = (t: { id: string; number: string; quantity: number }) => (
    <Link className="font-bold text-harbour-800 underline" to={paths.tray(t.id)}>
      {t.number}
    </Link>
  );
  return (
    <Card>
      <h2 className="mb-4 flex items-center gap-2 text-xl font-bold text-harbour-900">
        <GitBranch className="h-6 w-6" aria-hidden /> {t('genealogy.title')}
      </h2>
      {empty ? (
        <p className="text-harbour-700">{t('genealogy.none')}</p>
      ) : (
        <ul className="flex flex-col gap-2">
          {tray.parent && (
            <li>
              {t('genealogy.splitFrom')}
              {item(tray.parent)}
            </li>
          )}
          {tray.children.length > 0 && (
            <li>
              {t('genealogy.splitOff')}
              {tray.children.map((c, i) => (
                <span key={c.id}>
                  {i > 0 && ', '}
                  {item(c)} {t('genealogy.nowQty', { quantity: c.quantity })}
                </span>
              ))}
            </li>
          )}
          {tray.mergedInto && (
            <li>
              {t('genealogy.mergedInto')}
              {item(tray.mergedInto)}
            </li>
          )}
          {tray.mergedFrom.length > 0 && (
            <li>
              {t('genealogy.mergedIn')}
              {tray.mergedFrom.map((c, i) => (
                <span key={c.id}>
                  {i > 0 && ', '}
                  {item(c)} {t('genealogy.pieceQty', { quantity: c.quantity })}
                </span>
              ))}
            </li>
          )}
        </ul>
      )}
    </Card>
  );
}

const EVENT_COLUMNS = ['when', 'what', 'step', 'station', 'pieces', 'by', 'note'] as const;

export function EventsTable({ tray }: { tray: TrayView }) {
  const { t } = useTranslation('trays');
  return (
    <Card>
      <h2 className="mb-4 text-xl font-bold text-harbour-900">{t('events.title')}</h2>
      {tray.events.length === 0 ? (
        <p className="text-harbour-700">{t('events.none')}</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">{t('events.caption', { number: tray.number })}</caption>
            <thead className="bg-harbour-50">
              <tr>
                {EVENT_COLUMNS.map((h) => (
                  <th key={h} scope="col" className="px-2 py-2">
                    {t(`events.col.${h}`)}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {tray.events.map((e) => (
                <tr key={e.id} className="border-t border-harbour-100">
                  <td className="px-2 py-1 whitespace-nowrap">{formatDateTime(e.occurredAt)}</td>
                  <td className="px-2 py-1">{t(`events.type.${e.type}` as 'events.type.start', { defaultValue: humanise(e.type) })}</td>
                  <td className="px-2 py-1">{e.stepName ?? '—'}</td>
                  <td className="px-2 py-1">{e.stationName ?? '—'}</td>
                  <td className="px-2 py-1">
                    {e.type === 'finish'
                      ? `${t('events.finished', { good: e.goodQty ?? 0, scrap: e.scrapQty ?? 0 })}${e.scrapReason ? t('events.scrapReason', { reason: e.scrapReason }) : ''}`
                      : (e.qtyIn ?? '—')}
                  </td>
                  <td className="px-2 py-1">{e.by ?? '—'}</td>
                  <td className="px-2 py-1">{e.note ?? ''}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </Card>
  );
}

/** Take pieces off into new trays; a part may go back to an earlier step for rework. */
export function SplitForm({ tray, onChanged }: { tray: TrayView; onChanged?: () => void }) {
  const { t } = useTranslation('trays');
  const split = useSplitTray(tray.id, onChanged);
  const [parts, setParts] = useState<{ quantity: number; stepSeq: number | '' }[]>([{ quantity: 1, stepSeq: '' }]);
  const taken = parts.reduce((a, p) => a + (Number.isFinite(p.quantity) ? p.quantity : 0), 0);
  const current = tray.nextStep?.seq ?? null;
  const earlier = tray.routing.filter((s) => current != null && s.seq <= current);
  const can = tray.kind === 'tray' && tray.phase === 'waiting' && !tray.onHold;
  return (
    <Card>
      <h2 className="mb-2 flex items-center gap-2 text-xl font-bold text-harbour-900">
        <GitBranch className="h-6 w-6" aria-hidden /> {t('split.title')}
      </h2>
      {!can ? (
        <p className="text-harbour-700">{t('split.cannot')}</p>
      ) : (
        <form
          className="flex flex-col gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            split.mutate(
              { parts: parts.map((p) => ({ quantity: p.quantity, ...(p.stepSeq !== '' ? { stepSeq: p.stepSeq } : {}) })) },
              { onSuccess: () => setParts([{ quantity: 1, stepSeq: '' }]) },
            );
          }}
        >
          {parts.map((p, i) => (
            <div key={i} className="flex flex-wrap items-end gap-3">
              <TextField
                label={t('split.pieces', { n: i + 1 })}
                type="number"
                min={1}
                value={Number.isFinite(p.quantity) ? p.quantity : ''}
                onChange={(e) => setParts(parts.map((q, j) => (j === i ? { ...q, quantity: Math.round(Number(e.target.value)) } : q)))}
              />
              <label className="flex flex-col gap-1 text-sm font-bold">
                {t('split.next', { n: i + 1 })}
                <select
                  className="min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-2 font-normal"
                  value={p.stepSeq}
                  onChange={(e) => setParts(parts.map((q, j) => (j === i ? { ...q, stepSeq: e.target.value === '' ? '' : Number(e.target.value) } : q)))}
                >
                  <option value="">{t('split.same')}</option>
                  {earlier
                    .filter((s) => s.seq !== current)
                    .map((s) => (
                      <option key={s.seq} value={s.seq}>
                        {t('split.rework', { seq: s.seq, name: s.name })}
                      </option>
                    ))}
                </select>
              </label>
              {parts.length > 1 && (
                <Button variant="ghost" aria-label={t('split.remove', { n: i + 1 })} onClick={() => setParts(parts.filter((_, j) => j !== i))}>
                  <Trash2 className="h-5 w-5" aria-hidden />
                </Button>
              )}
            </div>
          ))}
          <p className={taken >= tray.quantity ? 'font-bold text-stop-700' : 'text-harbour-700'}>
            {t('split.moves', { taken, quantity: tray.quantity, left: tray.quantity - taken, number: tray.number })}
          </p>
          <div className="flex flex-wrap gap-2">
            <Button variant="secondary" onClick={() => setParts([...parts, { quantity: 1, stepSeq: '' }])}>
              <Plus className="h-5 w-5" aria-hidden /> {t('split.another')}
            </Button>
            <Button type="submit" disabled={split.isPending || taken >= tray.quantity || taken < 1}>
              {t('split.submit')}
            </Button>
          </div>
          {split.data && (
            <p role="status" className="font-bold text-ok-700">
              {t('split.done', { children: split.data.children.map((c) => c.number).join(', '), number: split.data.tray.number })}
            </p>
          )}
          {split.error && <ErrorPanel title={t('split.failed')} message={split.error.message} />}
        </form>
      )}
    </Card>
  );
}

/** Merge other trays of the same order, waiting for the same step, into this one. */
export function MergeForm({
  tray,
  candidates,
  onChanged,
}: {
  tray: TrayView;
  candidates: { id: string; number: string; quantity: number }[];
  onChanged?: () => void;
}) {
  const { t } = useTranslation('trays');
  const merge = useMergeTrays(onChanged);
  const [chosen, setChosen] = useState<string[]>([]);
  return (
    <Card>
      <h2 className="mb-2 flex items-center gap-2 text-xl font-bold text-harbour-900">
        <GitMerge className="h-6 w-6" aria-hidden /> {t('merge.title')}
      </h2>
      {candidates.length === 0 ? (
        <p className="text-harbour-700">{t('merge.none')}</p>
      ) : (
        <form
          className="flex flex-col gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            merge.mutate({ trayIds: [tray.id, ...chosen] }, { onSuccess: () => setChosen([]) });
          }}
        >
          <fieldset className="flex flex-wrap gap-4">
            <legend className="mb-1 text-sm font-bold">{t('merge.waiting', { step: tray.nextStep?.name ?? '' })}</legend>
            {candidates.map((c) => (
              <label key={c.id} className="flex min-h-11 items-center gap-2">
                <input
                  type="checkbox"
                  className="h-6 w-6 accent-harbour-800"
                  checked={chosen.includes(c.id)}
                  onChange={(e) => setChosen(e.target.checked ? [...chosen, c.id] : chosen.filter((x) => x !== c.id))}
                />
                {c.number} <Pill>{c.quantity}</Pill>
              </label>
            ))}
          </fieldset>
          <div>
            <Button type="submit" disabled={chosen.length === 0 || merge.isPending}>
              {t('merge.submit', { n: chosen.length || '', number: tray.number })}
            </Button>
          </div>
          {merge.data && (
            <p role="status" className="font-bold text-ok-700">
              {t('merge.done', { number: merge.data.tray.number, quantity: merge.data.tray.quantity, revision: merge.data.tray.revision })}
            </p>
          )}
          {merge.error && <ErrorPanel title={t('merge.failed')} message={merge.error.message} />}
        </form>
      )}
    </Card>
  );
}
