import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { factoryTodayDate } from '@/lib/datetime';
import { Plus, Trash2 } from 'lucide-react';
import { ADMIN_ONLY } from '@shared/domain/access';
import { WEEKDAYS, compileCalendar } from '@shared/domain/calendar';
import { calendarBody, type CalendarBody, type CalendarView, type WeekBody } from '@shared/schemas/calendar';
import { queryClient } from '@/lib/query-client';
import { calendarQueryOptions, useCalendar, useSaveCalendar } from '@/features/calendar/api/get-calendar';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Card, ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';

export const handle = { roles: ADMIN_ONLY };
export const loader = () => queryClient.ensureQueryData(calendarQueryOptions());

function hoursOf(week: WeekBody): number {
  try {
    const cal = compileCalendar({ timeZone: 'UTC', week, daysOff: [] });
    // a plain week of 1970 (5-11 January was Monday to Sunday)
    return cal.factory.workingMinutesBetween(Date.UTC(1970, 0, 5), Date.UTC(1970, 0, 12)) / 60;
  } catch {
    return 0;
  }
}

function WeekEditor({ week, onChange, label }: { week: WeekBody; onChange: (w: WeekBody) => void; label: string }) {
  const { t } = useTranslation('admin');
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="mb-2 font-bold">{t('calendar.weekHours', { label, hours: Math.round(hoursOf(week) * 10) / 10 })}</legend>
      {WEEKDAYS.map((d) => (
        <div key={d} className="flex flex-wrap items-end gap-3 border-b border-harbour-50 pb-2">
          <span className="w-28 pb-3 font-bold">{t(`calendar.day.${d}`)}</span>
          {week[d].length === 0 && <span className="pb-3 text-harbour-700">{t('calendar.noShift')}</span>}
          {week[d].map((s, i) => (
            <div key={i} className="flex items-end gap-2">
              <TextField
                label={t('calendar.shiftStarts', { day: t(`calendar.day.${d}`), n: i + 1 })}
                type="time"
                value={s.start}
                onChange={(e) => onChange({ ...week, [d]: week[d].map((x, j) => (j === i ? { ...x, start: e.target.value } : x)) })}
              />
              <TextField
                label={t('calendar.ends')}
                type="time"
                value={s.end}
                onChange={(e) => onChange({ ...week, [d]: week[d].map((x, j) => (j === i ? { ...x, end: e.target.value } : x)) })}
              />
              <Button
                variant="ghost"
                aria-label={t('calendar.removeShift', { day: t(`calendar.day.${d}`), n: i + 1 })}
                onClick={() => onChange({ ...week, [d]: week[d].filter((_, j) => j !== i) })}
              >
                <Trash2 className="h-5 w-5" aria-hidden />
              </Button>
            </div>
          ))}
          <Button variant="ghost" onClick={() => onChange({ ...week, [d]: [...week[d], { start: '08:00', end: '17:00' }] })}>
            <Plus className="h-5 w-5" aria-hidden /> {t('calendar.addShift')}
          </Button>
        </div>
      ))}
      <p className="text-sm text-harbour-700">{t('calendar.overnight')}</p>
    </fieldset>
  );
}

function DaysOff({
  days,
  onChange,
  label,
}: {
  days: { date: string; name: string }[];
  onChange: (d: { date: string; name: string }[]) => void;
  label: string;
}) {
  const { t } = useTranslation('admin');
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="mb-2 font-bold">{label}</legend>
      {days.map((d, i) => (
        <div key={i} className="flex flex-wrap items-end gap-2">
          <TextField
            label={t('calendar.dayOff', { n: i + 1 })}
            type="date"
            value={d.date}
            onChange={(e) => onChange(days.map((x, j) => (j === i ? { ...x, date: e.target.value } : x)))}
          />
          <TextField
            label={t('calendar.whatItIs')}
            value={d.name}
            onChange={(e) => onChange(days.map((x, j) => (j === i ? { ...x, name: e.target.value } : x)))}
          />
          <Button variant="ghost" aria-label={t('calendar.removeDayOff', { n: i + 1 })} onClick={() => onChange(days.filter((_, j) => j !== i))}>
            <Trash2 className="h-5 w-5" aria-hidden />
          </Button>
        </div>
      ))}
      <div>
        <Button variant="ghost" onClick={() => onChange([...days, { date: factoryTodayDate(), name: '' }])}>
          <Plus className="h-5 w-5" aria-hidden /> {t('calendar.addDayOff')}
        </Button>
      </div>
    </fieldset>
  );
}

function Editor({ view }: { view: CalendarView }) {
  const { t } = useTranslation('admin');
  const save = useSaveCalendar();
  const [draft, setDraft] = useState<CalendarBody>(() => ({
    timeZone: view.timeZone,
    week: view.week,
    daysOff: view.daysOff,
    stations: view.stations.filter((s) => s.week || s.daysOff.length).map((s) => ({ stationId: s.stationId, week: s.week, daysOff: s.daysOff })),
  }));
  const [problem, setProblem] = useState<string | null>(null);
  const own = (id: string) => draft.stations.find((s) => s.stationId === id);
  const setOwn = (id: string, patch: Partial<CalendarBody['stations'][number]> | null) =>
    setDraft((d) => ({
      ...d,
      stations:
        patch === null
          ? d.stations.filter((s) => s.stationId !== id)
          : own(id)
            ? d.stations.map((s) => (s.stationId === id ? { ...s, ...patch } : s))
            : [...d.stations, { stationId: id, week: null, daysOff: [], ...patch }],
    }));
  const zones = typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : [];
  return (
    <form
      className="flex flex-col gap-6"
      onSubmit={(e) => {
        e.preventDefault();
        const parsed = calendarBody.safeParse(draft);
        if (!parsed.success) {
          setProblem(parsed.error.issues.map((i) => `${i.path.join(' › ')}: ${i.message}`).join('; '));
          return;
        }
        setProblem(null);
        save.mutate(parsed.data);
      }}
    >
      <Card>
        <div className="max-w-md">
          <TextField
            label={t('calendar.timeZone')}
            list="time-zones"
            value={draft.timeZone}
            onChange={(e) => setDraft({ ...draft, timeZone: e.target.value })}
            hint={t('calendar.timeZoneHint', { example: 'Asia/Shanghai' })}
          />
          <datalist id="time-zones">
            {zones.map((z) => (
              <option key={z} value={z} />
            ))}
          </datalist>
        </div>
      </Card>
      <Card>
        <WeekEditor label={t('calendar.factoryWeek')} week={draft.week} onChange={(week) => setDraft({ ...draft, week })} />
        {view.isDefault && <p className="mt-2 text-sm text-harbour-700">{t('calendar.defaultWeek')}</p>}
      </Card>
      <Card>
        <DaysOff label={t('calendar.factoryDaysOff')} days={draft.daysOff} onChange={(daysOff) => setDraft({ ...draft, daysOff })} />
      </Card>
      <Card>
        <h2 className="mb-3 text-xl font-bold text-harbour-900">{t('calendar.otherHours')}</h2>
        <ul className="flex flex-col gap-4">
          {view.stations.map((s) => {
            const o = own(s.stationId);
            return (
              <li key={s.stationId} className="border-b border-harbour-50 pb-3">
                <div className="flex flex-wrap items-center gap-3">
                  <strong>
                    {s.code} · {s.name}
                  </strong>
                  {s.continuous ? (
                    <Pill tone="info">{t('calendar.roundTheClock')}</Pill>
                  ) : o ? (
                    <>
                      <Pill tone="warn">{t('calendar.ownHours')}</Pill>
                      <Button variant="ghost" onClick={() => setOwn(s.stationId, null)}>
                        {t('calendar.followAgain')}
                      </Button>
                    </>
                  ) : (
                    <>
                      <Pill>{t('calendar.follows')}</Pill>
                      <Button variant="ghost" onClick={() => setOwn(s.stationId, { week: draft.week })}>
                        {t('calendar.giveOwn')}
                      </Button>
                    </>
                  )}
                </div>
                {o && !s.continuous && (
                  <div className="mt-3 grid gap-4 xl:grid-cols-2">
                    <WeekEditor
                      label={t('calendar.stationWeek', { name: s.name })}
                      week={o.week ?? draft.week}
                      onChange={(week) => setOwn(s.stationId, { week })}
                    />
                    <DaysOff label={t('calendar.stationDaysOff', { name: s.name })} days={o.daysOff} onChange={(daysOff) => setOwn(s.stationId, { daysOff })} />
                  </div>
                )}
              </li>
            );
          })}
        </ul>
      </Card>
      {(problem || save.error) && <ErrorPanel title={t('notSaved')} message={problem ?? save.error!.message} />}
      {save.isSuccess && !save.isPending && (
        <p role="status" className="font-bold text-ok-700">
          {t('calendar.saved')}
        </p>
      )}
      <div>
        <Button type="submit" size="lg" disabled={save.isPending}>
          {t('calendar.save')}
        </Button>
      </div>
    </form>
  );
}

export function Component() {
  const { t } = useTranslation('admin');
  const cal = useCalendar();
  return (
    <>
      <PageHeader title={t('calendar.title')} subtitle={t('calendar.subtitle')} />
      {cal.isPending ? <Loading /> : cal.error ? <ErrorPanel message={cal.error.message} /> : <Editor view={cal.data} />}
    </>
  );
}
