import { useEffect, useState, type ReactNode } from 'react';
import { Link } from 'react-router';
import { useTranslation } from 'react-i18next';
import type { TFunction } from 'i18next';
import { AlertOctagon, CircleDashed, Clock, Flame, Hand, Hourglass, PackageCheck, PauseCircle, ShieldAlert, Timer, TrendingUp, Wrench } from 'lucide-react';
import type { WallView } from '@shared/schemas/live';
import type { WipKind } from '@shared/schemas/reports';
import { STATION_KIND_NAMES } from '@shared/domain/vocabulary';
import type { StationKind } from '@shared/domain/vocabulary';
import { factoryTime, minutesText } from '@/lib/duration';
import { formatDueDay } from '@/lib/datetime';
import { i18n } from '@/lib/i18n';
import { paths } from '@/config/paths';
import { cures } from '@shared/domain/traveller/station-kinds';

export type WallTheme = 'dark' | 'light';

// Two themes chosen in code rather than by the system setting: a wall display has no one to
// change its system setting. Every state carries a word and an icon; colour only helps.
const THEMES = {
  dark: {
    page: 'bg-wall-page text-white',
    tile: 'bg-wall-tile border-wall-edge',
    tileIdle: 'bg-wall-page border-wall-idle-edge border-dashed',
    tileHot: 'bg-wall-hot border-brass-400',
    muted: 'text-wall-muted',
    strong: 'text-white',
    panel: 'bg-wall-tile border-wall-edge',
    accent: 'text-brass-300',
    badge: 'bg-brass-300 text-harbour-900',
    stop: 'bg-wall-stop text-white',
  },
  light: {
    page: 'bg-paper text-ink',
    tile: 'bg-white border-harbour-100',
    tileIdle: 'bg-paper border-harbour-600 border-dashed',
    tileHot: 'bg-warn-50 border-warn-700',
    muted: 'text-harbour-700',
    strong: 'text-harbour-900',
    panel: 'bg-white border-harbour-100',
    accent: 'text-brass-700',
    badge: 'bg-harbour-800 text-white',
    stop: 'bg-stop-50 text-stop-700',
  },
} as const;

/** A kind of station by the name the tablets use, in the reader's language. */
export const kindName = (k: string) => {
  const n = STATION_KIND_NAMES[k as StationKind] ?? k.replace(/_/g, ' ');
  const en = n.charAt(0).toUpperCase() + n.slice(1);
  return i18n.t(`common:kind.${k}` as 'common:kind.fill', { defaultValue: en });
};

const fmt = (n: number) => n.toLocaleString('en-GB');

/** Ticks once a second so countdowns move without a request. */
export function useNow() {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const t = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(t);
  }, []);
  return now;
}

/** "17 min 26 s left": a countdown never reads as a clock time. */
export function leftText(ms: number, t: TFunction<'live'> = i18n.getFixedT(null, 'live')): string {
  const s = Math.max(0, Math.floor(ms / 1000));
  const h = Math.floor(s / 3600);
  const m = Math.floor((s % 3600) / 60);
  return h > 0 ? t('board.leftHours', { h, m }) : t('board.leftMinutes', { m, s: s % 60 });
}

// Everything on the wall is read from about 3 m: no text under 28 px (text-3xl is 30 px).
function Figure({
  icon,
  label,
  trays,
  pieces,
  theme,
  testId,
  quiet,
}: {
  icon: ReactNode;
  label: string;
  trays: number;
  pieces: number;
  theme: WallTheme;
  testId: string;
  quiet: boolean;
}) {
  const t = THEMES[theme];
  const { t: tr } = useTranslation('live');
  return (
    <div className="flex min-w-0 items-baseline justify-between gap-2" title={tr('board.pieces', { pieces: fmt(pieces) })}>
      <span className={`flex min-w-0 items-center gap-1 truncate text-3xl ${t.muted}`}>
        {icon}
        {label}
      </span>
      <span
        className={`${quiet ? 'text-3xl' : 'text-4xl'} leading-tight font-bold tabular-nums ${t.strong}`}
        data-testid={`count-${testId}`}
        aria-label={tr(trays === 1 ? 'board.countOne' : 'board.countMany', { trays: fmt(trays), pieces: fmt(pieces) })}
      >
        {fmt(trays)}
      </span>
    </div>
  );
}

/** A kind of station with nothing waiting, in process, curing or in its mould shop. */
const isIdle = (kind: WipKind) => kind.waiting.trays + kind.inProcess.trays + kind.curing.trays + kind.moulds === 0;

/** The wall's line of empty stations: each by name, in process order, dashed as on their tiles. */
function EmptyStations({ kinds, theme }: { kinds: WipKind[]; theme: WallTheme }) {
  const t = THEMES[theme];
  const { t: tr } = useTranslation('live');
  if (kinds.length === 0) return null;
  return (
    <div className="flex flex-wrap items-center gap-x-3 gap-y-2 text-3xl" data-testid="empty-stations">
      <span className={`font-bold ${t.strong}`}>{tr('board.emptyNow')}</span>
      {kinds.map((k) => (
        <section
          key={k.stationKind}
          aria-label={`${kindName(k.stationKind)}: ${tr('board.empty')}`}
          data-kind={k.stationKind}
          data-idle="yes"
          className={`flex items-center gap-1 rounded-2xl border-4 px-3 py-1 ${t.tileIdle} ${t.strong}`}
        >
          <CircleDashed className="h-7 w-7" aria-hidden /> {kindName(k.stationKind)}
        </section>
      ))}
    </div>
  );
}

export function KindTile({ kind, theme, bottleneck }: { kind: WipKind; theme: WallTheme; bottleneck: boolean }) {
  const t = THEMES[theme];
  const { t: tr } = useTranslation('live');
  const idle = isIdle(kind);
  const oven = cures(kind.stationKind);
  // An empty station looks quiet through a dashed outline, smaller figures and the word "Empty",
  // never through faded text: every word on the tile keeps its contrast (WCAG 2.1, 1.4.3).
  return (
    <section
      aria-label={kindName(kind.stationKind)}
      data-kind={kind.stationKind}
      className={`flex min-h-0 flex-col gap-0.5 rounded-2xl border-4 px-3 py-1.5 ${bottleneck ? t.tileHot : idle ? t.tileIdle : t.tile}`}
      data-idle={idle ? 'yes' : 'no'}
    >
      <h2 className={`text-3xl leading-tight font-bold break-words ${t.strong}`} data-testid="tile-name">
        {kindName(kind.stationKind)}
      </h2>
      {bottleneck && (
        <span className={`flex w-fit items-center gap-1 rounded-full px-2 text-3xl font-bold ${t.badge}`} data-testid="bottleneck-badge">
          <TrendingUp className="h-7 w-7" aria-hidden /> {tr('board.bottleneck')}
        </span>
      )}
      {idle && !bottleneck && (
        <span className={`flex w-fit items-center gap-1 text-3xl font-bold ${t.strong}`} data-testid="idle">
          <CircleDashed className="h-7 w-7" aria-hidden /> {tr('board.empty')}
        </span>
      )}
      {/* an empty station says so in one word: no column of zeros to read from across the room */}
      <div className={idle && !bottleneck ? 'sr-only' : 'flex flex-col'}>
        <Figure
          theme={theme}
          testId="waiting"
          icon={<Hourglass className="h-5 w-5" aria-hidden />}
          label={tr('board.waiting')}
          quiet={idle}
          trays={kind.waiting.trays}
          pieces={kind.waiting.pieces}
        />
        {oven ? (
          <Figure
            theme={theme}
            testId="curing"
            icon={<Flame className="h-5 w-5" aria-hidden />}
            label={tr('board.curing')}
            quiet={idle}
            trays={kind.curing.trays}
            pieces={kind.curing.pieces}
          />
        ) : (
          <Figure
            theme={theme}
            testId="in-process"
            icon={<Wrench className="h-5 w-5" aria-hidden />}
            label={tr('board.inProcess')}
            quiet={idle}
            trays={kind.inProcess.trays}
            pieces={kind.inProcess.pieces}
          />
        )}
        {kind.held > 0 && (
          <Figure
            theme={theme}
            testId="held"
            icon={<PauseCircle className="h-7 w-7" aria-hidden />}
            label={tr('board.held')}
            quiet={false}
            trays={kind.held}
            pieces={0}
          />
        )}
      </div>
      <footer className={`mt-auto flex flex-wrap items-center gap-x-3 text-3xl ${t.muted}`}>
        {kind.oldestMinutes != null && (
          <span className="flex items-center gap-1" aria-label={tr('board.oldestWaiting', { time: minutesText(kind.oldestMinutes, { glance: true }) })}>
            <Clock className="h-7 w-7" aria-hidden /> <strong className={t.strong}>{minutesText(kind.oldestMinutes, { glance: true })}</strong>
          </span>
        )}
        {kind.moulds > 0 && <span>{tr(kind.moulds === 1 ? 'board.mouldOne' : 'board.mouldMany', { count: kind.moulds })}</span>}
      </footer>
    </section>
  );
}

function Panel({
  title,
  icon,
  children,
  theme,
  count,
  id,
}: {
  title: string;
  icon: ReactNode;
  children: ReactNode;
  theme: WallTheme;
  count?: number;
  id?: string;
}) {
  const t = THEMES[theme];
  return (
    <section id={id} aria-label={title} className={`flex min-h-0 flex-1 scroll-mt-4 flex-col rounded-2xl border-4 px-4 py-3 ${t.panel}`}>
      <h2 className={`mb-2 flex items-center gap-2 text-3xl font-bold ${t.strong}`}>
        {icon} <span className="min-w-0 truncate">{title}</span>
        {count !== undefined && <span className={`ml-auto text-3xl ${t.muted}`}>{count}</span>}
      </h2>
      <div className="min-h-0 overflow-hidden">{children}</div>
    </section>
  );
}

/** "+N more": the wall shows a few one-line entries; the whole list is on the floor page. */
function More({ shown, total, to, theme }: { shown: number; total: number; to: string; theme: WallTheme }) {
  const { t } = useTranslation('live');
  if (total <= shown) return null;
  return (
    <li>
      <Link to={to} className={`inline-flex min-h-11 items-center font-bold underline ${THEMES[theme].accent}`} data-testid="more">
        {t('board.more', { count: total - shown })}
      </Link>
    </li>
  );
}

/** The whole floor on one screen: a tile per kind of work, and what needs someone's attention. */
export function WallBoard({ view, theme, compact = false }: { view: WallView; theme: WallTheme; compact?: boolean }) {
  const t = THEMES[theme];
  const { t: tr } = useTranslation('live');
  const now = useNow();
  const active = view.wip.kinds.filter((k) => k.stations.length > 0 || k.waiting.trays + k.inProcess.trays + k.curing.trays + k.moulds > 0);
  // on the wall, empty stations stand in one line under the tiles, so the busy ones have the room
  // to be read from across the floor; the floor page (compact) keeps a tile for every station
  const emptyKinds = compact ? [] : active.filter((k) => isIdle(k) && view.bottleneck?.stationKind !== k.stationKind);
  const tiles = compact ? active : active.filter((k) => !emptyKinds.includes(k));
  const tz = view.timeZone;
  const holdReason = (h: WallView['holds'][number]) => (i18n.language === 'zh-CN' && h.reasonZh ? h.reasonZh : h.reason);
  // one list of what waits for a supervisor: refusals, holds, then overrides already used
  const needs = [
    ...view.refusals.map((r) => ({
      key: `r${r.id}`,
      icon: <AlertOctagon className="mr-1 inline h-7 w-7" aria-hidden />,
      label: tr('board.refused'),
      text: `${r.trayNumber ?? tr('board.unknownTray')} · ${r.stationName ?? tr('board.aStation')}`,
      full: i18n.language === 'zh-CN' ? tr(`common:rejection.${r.code}` as 'common:rejection.on_hold', { defaultValue: r.message }) : r.message,
      muted: false,
    })),
    ...view.holds.map((h) => ({
      key: `h${h.trayId}`,
      icon: <PauseCircle className="mr-1 inline h-7 w-7" aria-hidden />,
      label: tr('board.onHold'),
      text: `${h.number} · ${holdReason(h) ?? kindName(h.stationKind)}`,
      full: holdReason(h) ?? '',
      muted: false,
    })),
    ...view.overrides.map((o) => ({
      key: `o${o.id}`,
      icon: <Hand className="mr-1 inline h-7 w-7" aria-hidden />,
      label: tr('board.override'),
      text: `${o.trayNumber} · ${o.supervisorName ?? tr('board.aSupervisor')}`,
      full: o.reason,
      muted: true,
    })),
  ];
  // the wall has room for a few one-line entries; the floor page (compact) lists them all
  const shownNeeds = compact ? needs.length : 3;
  const shownRisk = compact ? view.atRisk.length : 3;
  return (
    <div className={`grid gap-4 ${compact ? 'grid-cols-1 xl:grid-cols-[1fr_420px]' : 'h-full grid-cols-[1fr_400px] grid-rows-[minmax(0,1fr)]'}`}>
      <div className={compact ? 'contents' : 'flex min-h-0 flex-col gap-3'}>
        <div
          className={`grid gap-3 ${compact ? 'grid-cols-2 md:grid-cols-3 2xl:grid-cols-4' : 'min-h-0 flex-1 grid-cols-6'}`}
          // rows as tall as their busiest tile needs (a long name wraps onto a second line), sharing what is left
          style={compact ? undefined : { gridTemplateRows: `repeat(${Math.max(1, Math.ceil(tiles.length / 6))}, minmax(min-content, 1fr))` }}
        >
          {tiles.map((k) => (
            <KindTile key={k.stationKind} kind={k} theme={theme} bottleneck={view.bottleneck?.stationKind === k.stationKind} />
          ))}
        </div>
        <EmptyStations kinds={emptyKinds} theme={theme} />
      </div>
      <div className="flex min-h-0 flex-col gap-3">
        {view.bottleneck && (
          <p className={`truncate rounded-2xl border-4 px-4 py-2 text-3xl ${t.tileHot}`} data-testid="bottleneck-note">
            <TrendingUp className="mr-2 inline h-7 w-7" aria-hidden />
            <strong>{kindName(view.bottleneck.stationKind)}</strong>
            {tr('board.bottleneckNote', { waiting: view.bottleneck.waitingTrays, capacity: view.bottleneck.capacityTrays })}
          </p>
        )}
        <Panel theme={theme} title={tr('board.cureTitle')} icon={<Timer className="h-8 w-8" aria-hidden />} count={view.curing.length}>
          <ul className="flex flex-col gap-1 text-3xl">
            {view.curing.slice(0, compact ? 50 : 4).map((c) => {
              const left = Date.parse(c.readyAt) - now;
              return (
                <li key={c.trayId} className="flex justify-between gap-2 whitespace-nowrap">
                  <span className="font-bold">{c.number}</span>
                  <span className="tabular-nums" data-testid="cure-left">
                    {left <= 0 ? (
                      <span className="flex items-center gap-1 font-bold">
                        <PackageCheck className="h-7 w-7" aria-hidden /> {tr('board.ready')}
                      </span>
                    ) : (
                      leftText(left, tr)
                    )}
                  </span>
                </li>
              );
            })}
            {view.curing.length === 0 && <li className={t.muted}>{tr('board.ovenEmpty')}</li>}
          </ul>
        </Panel>
        <Panel id="needs-supervisor" theme={theme} title={tr('board.needsTitle')} icon={<ShieldAlert className="h-8 w-8" aria-hidden />} count={needs.length}>
          <ul className="flex flex-col gap-1 text-3xl">
            {needs.slice(0, shownNeeds).map((n) => (
              <li key={n.key} className={`truncate ${n.muted ? t.muted : ''}`} title={n.full}>
                {n.icon}
                <strong>{n.label}</strong> {n.text}
              </li>
            ))}
            <More shown={shownNeeds} total={needs.length} to={`${paths.floor}#needs-supervisor`} theme={theme} />
            {needs.length === 0 && <li className={t.muted}>{tr('board.nothingWaiting')}</li>}
          </ul>
        </Panel>
        <Panel id="at-risk" theme={theme} title={tr('board.riskTitle')} icon={<AlertOctagon className="h-8 w-8" aria-hidden />} count={view.atRisk.length}>
          <ul className="flex flex-col gap-1 text-3xl">
            {view.atRisk.slice(0, shownRisk).map((o) => (
              <li
                key={o.orderId}
                className="truncate"
                title={tr('board.riskDetail', {
                  number: o.number,
                  customer: o.customer,
                  risk: tr(o.risk === 'late' ? 'board.late' : 'board.atRisk'),
                  due: formatDueDay(o.dueDate),
                  expected: factoryTime(o.expectedAt, tz),
                })}
              >
                <strong>{o.number}</strong> {tr(o.risk === 'late' ? 'board.late' : 'board.atRisk')} · {o.customer}
              </li>
            ))}
            <More shown={shownRisk} total={view.atRisk.length} to={`${paths.floor}#at-risk`} theme={theme} />
            {view.atRisk.length === 0 && <li className={t.muted}>{tr('board.onCourse')}</li>}
          </ul>
        </Panel>
      </div>
    </div>
  );
}
