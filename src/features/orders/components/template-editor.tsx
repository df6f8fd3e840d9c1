import { useState, type ReactNode } from 'react';
import { ArrowDown, ArrowUp, Plus, Trash2 } from 'lucide-react';
import { STEP_CONDITIONS, expandRouting, type RoutingTemplate, type StepCondition, type TemplateEntry } from '@shared/domain/routing';
import { routingTemplateSchema } from '@shared/schemas/routing';
import { STATION_KINDS, type StationKind } from '@shared/domain/vocabulary';
import { Button } from '@/components/ui/button';
import { Card, ErrorPanel } from '@/components/ui/panels';
import { CheckboxField, TextField } from '@/components/ui/field';
import { humanise } from '@/lib/labels';
import { useSaveTemplate } from '../api/routing';
import { cures } from '@shared/domain/traveller/station-kinds';

const input = 'min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-2';
const CONDITION_LABELS: Record<StepCondition, string> = {
  always: 'Always',
  back_logo: 'When there is a back logo',
  printing: 'When printed areas',
  epoxy: 'When epoxy dome',
  fittings: 'When there are fittings',
  posts: 'When fittings need posts',
  safety_pin: 'When the backing is a safety pin',
  antique: 'When the finish is antique',
  second_plating: 'When the finish is two-tone',
  sandblast: 'When sandblasted',
};

/** A small captioned control; the aria-label keeps each row's controls apart for screen readers. */
function Cap({ caption, children }: { caption: string; children: ReactNode }) {
  return (
    <label className="flex flex-col gap-0.5 text-xs font-bold text-harbour-700">
      {caption}
      {children}
    </label>
  );
}

function NumberCell({ label, caption, value, onChange, step = '0.5' }: { label: string; caption: string; value: number; onChange: (v: number) => void; step?: string }) {
  return (
    <Cap caption={caption}>
      <input aria-label={label} type="number" min={0} step={step} className={`${input} w-24`} value={value} onChange={(e) => onChange(Number(e.target.value))} />
    </Cap>
  );
}

/** Admins edit a process's template: steps, times, conditions and how colours are cured. A preview shows the expansion. */
export function TemplateEditor({ template }: { template: RoutingTemplate }) {
  const [draft, setDraft] = useState<RoutingTemplate>(template);
  const [colours, setColours] = useState(3);
  const [flags, setFlags] = useState({ backLogo: false, printing: false, epoxy: false, sandblast: false, antique: false, twoTone: false, safetyPin: false });
  const save = useSaveTemplate();
  const parsed = routingTemplateSchema.safeParse(draft);
  const setEntry = (i: number, e: TemplateEntry) => setDraft({ ...draft, steps: draft.steps.map((x, j) => (j === i ? e : x)) });
  const move = (i: number, by: -1 | 1) => {
    const steps = [...draft.steps];
    const [s] = steps.splice(i, 1);
    steps.splice(i + by, 0, s);
    setDraft({ ...draft, steps });
  };
  const preview = parsed.success
    ? expandRouting(parsed.data, {
        process: draft.process,
        colours: Array.from({ length: colours }),
        backLogo: flags.backLogo,
        printing: flags.printing,
        epoxy: flags.epoxy,
        sandblast: flags.sandblast,
        backing: { type: flags.safetyPin ? 'safety_pin' : 'butterfly_clutch', count: 1 },
        plating: flags.antique ? 'antique_gold' : 'gold',
        secondPlating: flags.twoTone ? 'nickel' : null,
      })
    : [];

  return (
    <div className="grid gap-6 xl:grid-cols-[2fr_1fr]">
      <Card>
        <div className="mb-4 flex flex-wrap items-end gap-3">
          <TextField label="Template name" value={draft.name} onChange={(e) => setDraft({ ...draft, name: e.target.value })} />
          <Button disabled={!parsed.success || save.isPending} onClick={() => save.mutate(draft)}>
            Save template
          </Button>
          <Button variant="secondary" onClick={() => setDraft(template)}>
            Discard changes
          </Button>
          {save.isSuccess && (
            <span role="status" className="font-bold text-ok-700">
              Saved. New orders use it; released orders keep their routing.
            </span>
          )}
        </div>
        <ol className="flex flex-col gap-2">
          {draft.steps.map((e, i) => (
            <li key={i} className="rounded-lg border border-harbour-100 p-3">
              <div className="flex flex-wrap items-end gap-2">
                <span className="w-6 font-bold">{i + 1}</span>
                {e.type === 'step' ? (
                  <>
                    <Cap caption="Step name">
                      <input aria-label={`Entry ${i + 1} name`} className={`${input} w-52`} value={e.name} onChange={(ev) => setEntry(i, { ...e, name: ev.target.value })} />
                    </Cap>
                    <Cap caption="Station kind">
                      <select
                        aria-label={`Entry ${i + 1} station kind`}
                        className={`${input} w-36`}
                        value={e.stationKind}
                        onChange={(ev) => {
                          const kind = ev.target.value as StationKind;
                          setEntry(i, { ...e, stationKind: kind, cureMinutes: cures(kind) ? (e.cureMinutes ?? 120) : null });
                        }}
                      >
                        {STATION_KINDS.map((k) => (
                          <option key={k} value={k}>
                            {humanise(k)}
                          </option>
                        ))}
                      </select>
                    </Cap>
                    <Cap caption="Included">
                      <select aria-label={`Entry ${i + 1} condition`} className={`${input} w-52`} value={e.when ?? 'always'} onChange={(ev) => setEntry(i, { ...e, when: ev.target.value as StepCondition })}>
                        {STEP_CONDITIONS.map((c) => (
                          <option key={c} value={c}>
                            {CONDITION_LABELS[c]}
                          </option>
                        ))}
                      </select>
                    </Cap>
                    <NumberCell label={`Entry ${i + 1} minutes per tray`} caption="Min / tray" value={e.trayMinutes} onChange={(v) => setEntry(i, { ...e, trayMinutes: v })} />
                    <NumberCell label={`Entry ${i + 1} minutes per piece`} caption="Min / piece" value={e.pieceMinutes} step="0.01" onChange={(v) => setEntry(i, { ...e, pieceMinutes: v })} />
                    {cures(e.stationKind) && (
                      <NumberCell label={`Entry ${i + 1} minimum cure minutes`} caption="Cure at least" value={e.cureMinutes ?? 0} step="1" onChange={(v) => setEntry(i, { ...e, cureMinutes: Math.round(v) })} />
                    )}
                  </>
                ) : (
                  <>
                    <span className="self-center font-bold">One fill per colour</span>
                    <NumberCell label="Fill minutes per tray" caption="Fill min / tray" value={e.fill.trayMinutes} onChange={(v) => setEntry(i, { ...e, fill: { ...e.fill, trayMinutes: v } })} />
                    <NumberCell label="Fill minutes per piece" caption="Fill min / piece" value={e.fill.pieceMinutes} step="0.01" onChange={(v) => setEntry(i, { ...e, fill: { ...e.fill, pieceMinutes: v } })} />
                    <Cap caption="Curing">
                      <select aria-label="How colours are cured" className={`${input} w-56`} value={e.cure} onChange={(ev) => setEntry(i, { ...e, cure: ev.target.value as 'each' | 'once' | 'none' })}>
                        <option value="each">Cure after every colour</option>
                        <option value="once">One bake after all colours</option>
                        <option value="none">No cure (air-dried)</option>
                      </select>
                    </Cap>
                    {e.cure !== 'none' && (
                      <NumberCell label="Minimum cure minutes" caption="Cure at least" value={e.cureStep.cureMinutes} step="1" onChange={(v) => setEntry(i, { ...e, cureStep: { ...e.cureStep, cureMinutes: Math.round(v) } })} />
                    )}
                    {e.cure === 'once' && (
                      <Cap caption="Bake step name">
                        <input aria-label="Name of the bake" className={`${input} w-48`} value={e.onceName} onChange={(ev) => setEntry(i, { ...e, onceName: ev.target.value })} />
                      </Cap>
                    )}
                  </>
                )}
                <span className="ml-auto flex">
                  <Button variant="ghost" aria-label={`Move entry ${i + 1} up`} disabled={i === 0} onClick={() => move(i, -1)}>
                    <ArrowUp className="h-5 w-5" aria-hidden />
                  </Button>
                  <Button variant="ghost" aria-label={`Move entry ${i + 1} down`} disabled={i === draft.steps.length - 1} onClick={() => move(i, 1)}>
                    <ArrowDown className="h-5 w-5" aria-hidden />
                  </Button>
                  <Button variant="ghost" aria-label={`Remove entry ${i + 1}`} onClick={() => setDraft({ ...draft, steps: draft.steps.filter((_, j) => j !== i) })}>
                    <Trash2 className="h-5 w-5" aria-hidden />
                  </Button>
                </span>
              </div>
            </li>
          ))}
        </ol>
        <div className="mt-3">
          <Button
            variant="secondary"
            onClick={() => setDraft({ ...draft, steps: [...draft.steps, { type: 'step', name: 'New step', stationKind: 'inspect', trayMinutes: 5, pieceMinutes: 0, when: 'always' }] })}
          >
            <Plus className="h-5 w-5" aria-hidden /> Add a step
          </Button>
        </div>
        {!parsed.success && (
          <ul role="alert" className="mt-3 list-disc pl-6 text-sm font-bold text-stop-700">
            {parsed.error.issues.slice(0, 5).map((iss, k) => (
              <li key={k}>
                {iss.path.join(' › ')}: {iss.message}
              </li>
            ))}
          </ul>
        )}
        {save.error && <ErrorPanel title="Not saved" message={save.error.message} />}
      </Card>
      <Card>
        <h2 className="mb-2 text-lg font-bold text-harbour-900">Preview</h2>
        <div className="mb-3 flex flex-wrap items-end gap-3">
          <TextField label="Colours" type="number" min={0} max={24} value={colours} onChange={(e) => setColours(Math.max(0, Math.min(24, Math.round(Number(e.target.value)))))} />
          <CheckboxField label="Back logo" checked={flags.backLogo} onChange={(e) => setFlags({ ...flags, backLogo: e.target.checked })} />
          <CheckboxField label="Printing" checked={flags.printing} onChange={(e) => setFlags({ ...flags, printing: e.target.checked })} />
          <CheckboxField label="Epoxy" checked={flags.epoxy} onChange={(e) => setFlags({ ...flags, epoxy: e.target.checked })} />
          <CheckboxField label="Sandblast" checked={flags.sandblast} onChange={(e) => setFlags({ ...flags, sandblast: e.target.checked })} />
          <CheckboxField label="Antique finish" checked={flags.antique} onChange={(e) => setFlags({ ...flags, antique: e.target.checked })} />
          <CheckboxField label="Two-tone" checked={flags.twoTone} onChange={(e) => setFlags({ ...flags, twoTone: e.target.checked })} />
          <CheckboxField label="Safety pin" checked={flags.safetyPin} onChange={(e) => setFlags({ ...flags, safetyPin: e.target.checked })} />
        </div>
        <ol className="flex flex-col gap-1 text-sm">
          {preview.map((s) => (
            <li key={s.seq}>
              {s.seq}. {s.name} <span className="text-harbour-700">({humanise(s.stationKind)}{s.cureMinutes ? `, at least ${s.cureMinutes} min` : ''})</span>
            </li>
          ))}
        </ol>
      </Card>
    </div>
  );
}
