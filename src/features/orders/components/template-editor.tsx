import { useState, type ReactNode } from 'react';
import { ArrowDown, ArrowUp, Plus, Trash2 } from 'lucide-react';
import { useTranslation } from 'react-i18next';
import { STEP_CONDITIONS, expandRouting, type RoutingTemplate, type StepCondition, type TemplateEntry } from '@shared/domain/routing';
import { routingTemplateSchema } from '@shared/schemas/routing';
import { STATION_KINDS, type StationKind } from '@shared/domain/vocabulary';
import { Button } from '@/components/ui/button';
import { Card, ErrorPanel } from '@/components/ui/panels';
import { CheckboxField, TextField } from '@/components/ui/field';
import { useSaveTemplate } from '../api/routing';
import { cures } from '@shared/domain/traveller/station-kinds';

const input = 'min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-2';

/** A small captioned control; the aria-label keeps each row's controls apart for screen readers. */
function Cap({ caption, children }: { caption: string; children: ReactNode }) {
  return (
    <label className="flex flex-col gap-0.5 text-xs font-bold text-harbour-700">
      {caption}
      {children}
    </label>
  );
}

function NumberCell({
  label,
  caption,
  value,
  onChange,
  step = '0.5',
}: {
  label: string;
  caption: string;
  value: number;
  onChange: (v: number) => void;
  step?: string;
}) {
  return (
    <Cap caption={caption}>
      <input
        aria-label={label}
        type="number"
        min={0}
        step={step}
        className={`${input} w-24`}
        value={value}
        onChange={(e) => onChange(Number(e.target.value))}
      />
    </Cap>
  );
}

/** Admins edit a process's template: steps, times, conditions and how colours are cured. A preview shows the expansion. */
export function TemplateEditor({ template }: { template: RoutingTemplate }) {
  const { t } = useTranslation(['admin', 'common']);
  const kindName = (k: string) => t(`common:kind.${k}` as 'common:kind.fill', { defaultValue: k });
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
          <TextField label={t('templateEditor.name')} value={draft.name} onChange={(e) => setDraft({ ...draft, name: e.target.value })} />
          <Button disabled={!parsed.success || save.isPending} onClick={() => save.mutate(draft)}>
            {t('templateEditor.save')}
          </Button>
          <Button variant="secondary" onClick={() => setDraft(template)}>
            {t('templateEditor.discard')}
          </Button>
          {save.isSuccess && (
            <span role="status" className="font-bold text-ok-700">
              {t('templateEditor.saved')}
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
                    <Cap caption={t('templateEditor.stepName')}>
                      <input
                        aria-label={t('templateEditor.entryName', { n: i + 1 })}
                        className={`${input} w-52`}
                        value={e.name}
                        onChange={(ev) => setEntry(i, { ...e, name: ev.target.value })}
                      />
                    </Cap>
                    <Cap caption={t('templateEditor.stationKind')}>
                      <select
                        aria-label={t('templateEditor.entryKind', { n: i + 1 })}
                        className={`${input} w-36`}
                        value={e.stationKind}
                        onChange={(ev) => {
                          const kind = ev.target.value as StationKind;
                          setEntry(i, { ...e, stationKind: kind, cureMinutes: cures(kind) ? (e.cureMinutes ?? 120) : null });
                        }}
                      >
                        {STATION_KINDS.map((k) => (
                          <option key={k} value={k}>
                            {kindName(k)}
                          </option>
                        ))}
                      </select>
                    </Cap>
                    <Cap caption={t('templateEditor.included')}>
                      <select
                        aria-label={t('templateEditor.entryCondition', { n: i + 1 })}
                        className={`${input} w-52`}
                        value={e.when ?? 'always'}
                        onChange={(ev) => setEntry(i, { ...e, when: ev.target.value as StepCondition })}
                      >
                        {STEP_CONDITIONS.map((c) => (
                          <option key={c} value={c}>
                            {t(`templateEditor.condition.${c}`)}
                          </option>
                        ))}
                      </select>
                    </Cap>
                    <NumberCell
                      label={t('templateEditor.entryTrayMin', { n: i + 1 })}
                      caption={t('templateEditor.minTray')}
                      value={e.trayMinutes}
                      onChange={(v) => setEntry(i, { ...e, trayMinutes: v })}
                    />
                    <NumberCell
                      label={t('templateEditor.entryPieceMin', { n: i + 1 })}
                      caption={t('templateEditor.minPiece')}
                      value={e.pieceMinutes}
                      step="0.01"
                      onChange={(v) => setEntry(i, { ...e, pieceMinutes: v })}
                    />
                    {cures(e.stationKind) && (
                      <NumberCell
                        label={t('templateEditor.entryCure', { n: i + 1 })}
                        caption={t('templateEditor.cureAtLeast')}
                        value={e.cureMinutes ?? 0}
                        step="1"
                        onChange={(v) => setEntry(i, { ...e, cureMinutes: Math.round(v) })}
                      />
                    )}
                  </>
                ) : (
                  <>
                    <span className="self-center font-bold">{t('templateEditor.oneFill')}</span>
                    <NumberCell
                      label={t('templateEditor.fillTray')}
                      caption={t('templateEditor.fillTrayCap')}
                      value={e.fill.trayMinutes}
                      onChange={(v) => setEntry(i, { ...e, fill: { ...e.fill, trayMinutes: v } })}
                    />
                    <NumberCell
                      label={t('templateEditor.fillPiece')}
                      caption={t('templateEditor.fillPieceCap')}
                      value={e.fill.pieceMinutes}
                      step="0.01"
                      onChange={(v) => setEntry(i, { ...e, fill: { ...e.fill, pieceMinutes: v } })}
                    />
                    <Cap caption={t('templateEditor.curing')}>
                      <select
                        aria-label={t('templateEditor.howCured')}
                        className={`${input} w-56`}
                        value={e.cure}
                        onChange={(ev) => setEntry(i, { ...e, cure: ev.target.value as 'each' | 'once' | 'none' })}
                      >
                        <option value="each">{t('templateEditor.cureEach')}</option>
                        <option value="once">{t('templateEditor.cureOnce')}</option>
                        <option value="none">{t('templateEditor.cureNone')}</option>
                      </select>
                    </Cap>
                    {e.cure !== 'none' && (
                      <NumberCell
                        label={t('templateEditor.minCure')}
                        caption={t('templateEditor.cureAtLeast')}
                        value={e.cureStep.cureMinutes}
                        step="1"
                        onChange={(v) => setEntry(i, { ...e, cureStep: { ...e.cureStep, cureMinutes: Math.round(v) } })}
                      />
                    )}
                    {e.cure === 'once' && (
                      <Cap caption={t('templateEditor.bakeName')}>
                        <input
                          aria-label={t('templateEditor.bakeNameLabel')}
                          className={`${input} w-48`}
                          value={e.onceName}
                          onChange={(ev) => setEntry(i, { ...e, onceName: ev.target.value })}
                        />
                      </Cap>
                    )}
                  </>
                )}
                <span className="ml-auto flex">
                  <Button variant="ghost" aria-label={t('templateEditor.up', { n: i + 1 })} disabled={i === 0} onClick={() => move(i, -1)}>
                    <ArrowUp className="h-5 w-5" aria-hidden />
                  </Button>
                  <Button
                    variant="ghost"
                    aria-label={t('templateEditor.down', { n: i + 1 })}
                    disabled={i === draft.steps.length - 1}
                    onClick={() => move(i, 1)}
                  >
                    <ArrowDown className="h-5 w-5" aria-hidden />
                  </Button>
                  <Button
                    variant="ghost"
                    aria-label={t('templateEditor.remove', { n: i + 1 })}
                    onClick={() => setDraft({ ...draft, steps: draft.steps.filter((_, j) => j !== i) })}
                  >
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
            onClick={() =>
              setDraft({
                ...draft,
                steps: [
                  ...draft.steps,
                  { type: 'step', name: t('templateEditor.newStep'), stationKind: 'inspect', trayMinutes: 5, pieceMinutes: 0, when: 'always' },
                ],
              })
            }
          >
            <Plus className="h-5 w-5" aria-hidden /> {t('templateEditor.addStep')}
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
        {save.error && <ErrorPanel title={t('notSaved')} message={save.error.message} />}
      </Card>
      <Card>
        <h2 className="mb-2 text-lg font-bold text-harbour-900">{t('templateEditor.preview')}</h2>
        <div className="mb-3 flex flex-wrap items-end gap-3">
          <TextField
            label={t('templateEditor.colours')}
            type="number"
            min={0}
            max={24}
            value={colours}
            onChange={(e) => setColours(Math.max(0, Math.min(24, Math.round(Number(e.target.value)))))}
          />
          <CheckboxField label={t('templateEditor.backLogo')} checked={flags.backLogo} onChange={(e) => setFlags({ ...flags, backLogo: e.target.checked })} />
          <CheckboxField label={t('templateEditor.printing')} checked={flags.printing} onChange={(e) => setFlags({ ...flags, printing: e.target.checked })} />
          <CheckboxField label={t('templateEditor.epoxy')} checked={flags.epoxy} onChange={(e) => setFlags({ ...flags, epoxy: e.target.checked })} />
          <CheckboxField
            label={t('templateEditor.sandblast')}
            checked={flags.sandblast}
            onChange={(e) => setFlags({ ...flags, sandblast: e.target.checked })}
          />
          <CheckboxField label={t('templateEditor.antique')} checked={flags.antique} onChange={(e) => setFlags({ ...flags, antique: e.target.checked })} />
          <CheckboxField label={t('templateEditor.twoTone')} checked={flags.twoTone} onChange={(e) => setFlags({ ...flags, twoTone: e.target.checked })} />
          <CheckboxField
            label={t('templateEditor.safetyPin')}
            checked={flags.safetyPin}
            onChange={(e) => setFlags({ ...flags, safetyPin: e.target.checked })}
          />
        </div>
        <ol className="flex flex-col gap-1 text-sm">
          {preview.map((s) => (
            <li key={s.seq}>
              {s.seq}. {s.name}{' '}
              <span className="text-harbour-700">
                ({kindName(s.stationKind)}
                {s.cureMinutes ? t('templateEditor.atLeast', { min: s.cureMinutes }) : ''})
              </span>
            </li>
          ))}
        </ol>
      </Card>
    </div>
  );
}
