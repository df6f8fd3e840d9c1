import { useState } from 'react';
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

/** The routing as a checklist: done, current, to do. */
export function RoutingProgress({ tray }: { tray: TrayView }) {
  const current = tray.nextStep?.seq ?? null;
  const finished = tray.phase === 'done';
  return (
    <Card>
      <h2 className="mb-4 text-xl font-bold text-harbour-900">Routing</h2>
      <ol className="grid gap-1 md:grid-cols-2">
        {tray.routing.map((s) => {
          const done = finished || (current != null && s.seq < current);
          const here = s.seq === current;
          return (
            <li key={s.seq} className={`flex items-center gap-2 rounded-lg px-2 py-1 ${here ? 'bg-brass-300/40 font-bold' : ''}`} aria-current={here ? 'step' : undefined}>
              {done ? <CheckSquare className="h-5 w-5 text-ok-700" aria-label="done" /> : here ? <SquareArrowRight className="h-5 w-5 text-harbour-800" aria-label="current" /> : <Square className="h-5 w-5 text-harbour-600" aria-label="to do" />}
              <span>
                {s.seq}. {s.name}
                {cures(s.stationKind) && s.cureMinutes ? <span className="text-sm text-harbour-700"> · at least {s.cureMinutes} min</span> : null}
              </span>
            </li>
          );
        })}
      </ol>
    </Card>
  );
}

export function Genealogy({ tray }: { tray: TrayView }) {
  const empty = !tray.parent && tray.children.length === 0 && !tray.mergedInto && tray.mergedFrom.length === 0;
  const item = (t: { id: string; number: string; quantity: number }) => (
    <Link className="font-bold text-harbour-800 underline" to={paths.tray(t.id)}>
      {t.number}
    </Link>
  );
  return (
    <Card>
      <h2 className="mb-4 flex items-center gap-2 text-xl font-bold text-harbour-900">
        <GitBranch className="h-6 w-6" aria-hidden /> Genealogy
      </h2>
      {empty ? (
        <p className="text-harbour-700">Released as it is: never split or merged.</p>
      ) : (
        <ul className="flex flex-col gap-2">
          {tray.parent && <li>Split from {item(tray.parent)}</li>}
          {tray.children.length > 0 && (
            <li>
              Split off:{' '}
              {tray.children.map((c, i) => (
                <span key={c.id}>
                  {i > 0 && ', '}
                  {item(c)} ({c.quantity} now)
                </span>
              ))}
            </li>
          )}
          {tray.mergedInto && <li>Merged into {item(tray.mergedInto)}</li>}
          {tray.mergedFrom.length > 0 && (
            <li>
              Merged in:{' '}
              {tray.mergedFrom.map((c, i) => (
                <span key={c.id}>
                  {i > 0 && ', '}
                  {item(c)} ({c.quantity} pieces)
                </span>
              ))}
            </li>
          )}
        </ul>
      )}
    </Card>
  );
}

export function EventsTable({ tray }: { tray: TrayView }) {
  return (
    <Card>
      <h2 className="mb-4 text-xl font-bold text-harbour-900">Scans and changes</h2>
      {tray.events.length === 0 ? (
        <p className="text-harbour-700">Nothing recorded yet: the traveller waits for its first step.</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Events of tray {tray.number}</caption>
            <thead className="bg-harbour-50">
              <tr>
                {['When', 'What', 'Step', 'Station', 'Pieces', 'By', 'Note'].map((h) => (
                  <th key={h} scope="col" className="px-2 py-2">
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {tray.events.map((e) => (
                <tr key={e.id} className="border-t border-harbour-100">
                  <td className="px-2 py-1 whitespace-nowrap">{formatDateTime(e.occurredAt)}</td>
                  <td className="px-2 py-1">{humanise(e.type)}</td>
                  <td className="px-2 py-1">{e.stepName ?? '—'}</td>
                  <td className="px-2 py-1">{e.stationName ?? '—'}</td>
                  <td className="px-2 py-1">
                    {e.type === 'finish' ? `${e.goodQty ?? 0} good, ${e.scrapQty ?? 0} scrap${e.scrapReason ? ` (${e.scrapReason})` : ''}` : (e.qtyIn ?? '—')}
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
  const split = useSplitTray(tray.id, onChanged);
  const [parts, setParts] = useState<{ quantity: number; stepSeq: number | '' }[]>([{ quantity: 1, stepSeq: '' }]);
  const taken = parts.reduce((a, p) => a + (Number.isFinite(p.quantity) ? p.quantity : 0), 0);
  const current = tray.nextStep?.seq ?? null;
  const earlier = tray.routing.filter((s) => current != null && s.seq <= current);
  const can = tray.kind === 'tray' && tray.phase === 'waiting' && !tray.onHold;
  return (
    <Card>
      <h2 className="mb-2 flex items-center gap-2 text-xl font-bold text-harbour-900">
        <GitBranch className="h-6 w-6" aria-hidden /> Split this tray
      </h2>
      {!can ? (
        <p className="text-harbour-700">Only a tray waiting for its next step (not in process, curing or on hold) can be split.</p>
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
                label={`New tray ${i + 1}: pieces`}
                type="number"
                min={1}
                value={Number.isFinite(p.quantity) ? p.quantity : ''}
                onChange={(e) => setParts(parts.map((q, j) => (j === i ? { ...q, quantity: Math.round(Number(e.target.value)) } : q)))}
              />
              <label className="flex flex-col gap-1 text-sm font-bold">
                {`New tray ${i + 1}: next step`}
                <select
                  className="min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-2 font-normal"
                  value={p.stepSeq}
                  onChange={(e) => setParts(parts.map((q, j) => (j === i ? { ...q, stepSeq: e.target.value === '' ? '' : Number(e.target.value) } : q)))}
                >
                  <option value="">Same as this tray</option>
                  {earlier
                    .filter((s) => s.seq !== current)
                    .map((s) => (
                      <option key={s.seq} value={s.seq}>
                        Rework from {s.seq}. {s.name}
                      </option>
                    ))}
                </select>
              </label>
              {parts.length > 1 && (
                <Button variant="ghost" aria-label={`Remove new tray ${i + 1}`} onClick={() => setParts(parts.filter((_, j) => j !== i))}>
                  <Trash2 className="h-5 w-5" aria-hidden />
                </Button>
              )}
            </div>
          ))}
          <p className={taken >= tray.quantity ? 'font-bold text-stop-700' : 'text-harbour-700'}>
            {taken} of {tray.quantity} pieces move; {tray.quantity - taken} stay on {tray.number}.
          </p>
          <div className="flex flex-wrap gap-2">
            <Button variant="secondary" onClick={() => setParts([...parts, { quantity: 1, stepSeq: '' }])}>
              <Plus className="h-5 w-5" aria-hidden /> Another new tray
            </Button>
            <Button type="submit" disabled={split.isPending || taken >= tray.quantity || taken < 1}>
              Split
            </Button>
          </div>
          {split.data && (
            <p role="status" className="font-bold text-ok-700">
              Split done: print the new travellers ({split.data.children.map((c) => c.number).join(', ')}) and the new revision of {split.data.tray.number}.
            </p>
          )}
          {split.error && <ErrorPanel title="Not split" message={split.error.message} />}
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
  const merge = useMergeTrays(onChanged);
  const [chosen, setChosen] = useState<string[]>([]);
  return (
    <Card>
      <h2 className="mb-2 flex items-center gap-2 text-xl font-bold text-harbour-900">
        <GitMerge className="h-6 w-6" aria-hidden /> Merge into this tray
      </h2>
      {candidates.length === 0 ? (
        <p className="text-harbour-700">No other tray of this order waits for the same step.</p>
      ) : (
        <form
          className="flex flex-col gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            merge.mutate({ trayIds: [tray.id, ...chosen] }, { onSuccess: () => setChosen([]) });
          }}
        >
          <fieldset className="flex flex-wrap gap-4">
            <legend className="mb-1 text-sm font-bold">Trays waiting for {tray.nextStep?.name}</legend>
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
              Merge {chosen.length || ''} into {tray.number}
            </Button>
          </div>
          {merge.data && (
            <p role="status" className="font-bold text-ok-700">
              Merged: {merge.data.tray.number} now holds {merge.data.tray.quantity}. Print its new revision {merge.data.tray.revision}.
            </p>
          )}
          {merge.error && <ErrorPanel title="Not merged" message={merge.error.message} />}
        </form>
      )}
    </Card>
  );
}
