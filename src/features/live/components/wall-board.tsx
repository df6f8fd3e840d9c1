import { useEffect, useState, type ReactNode } from 'react';
import { AlertOctagon, CircleDashed, Clock, Flame, Hand, Hourglass, PackageCheck, PauseCircle, ShieldAlert, Timer, TrendingUp, Wrench } from 'lucide-react';
import type { WallView } from '@shared/schemas/live';
import type { WipKind } from '@shared/schemas/reports';
import { STATION_KIND_NAMES } from '@shared/domain/vocabulary';
import type { StationKind } from '@shared/domain/vocabulary';
import { factoryTime, minutesText } from '@/lib/duration';

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

export const kindName = (k: string) => {
  const n = STATION_KIND_NAMES[k as StationKind] ?? k.replace(/_/g, ' ');
  return n.charAt(0).toUpperCase() + n.slice(1);
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

function Figure({ icon, label, trays, pieces, theme, testId, quiet }: { icon: ReactNode; label: string; trays: number; pieces: number; theme: WallTheme; testId: string; quiet: boolean }) {
  const t = THEMES[theme];
  return (
    <div className="flex min-w-0 flex-col">
      <span className={`flex items-center gap-1 text-xl ${t.muted}`}>
        {icon}
        {label}
      </span>
      <span className="flex items-baseline gap-1">
        <span className={`${quiet ? 'text-3xl' : 'text-5xl'} leading-tight font-bold tabular-nums ${t.strong}`} data-testid={`count-${testId}`}>
          {fmt(trays)}
        </span>
        <span className={`text-lg ${t.muted}`}>{trays === 1 ? 'tray' : 'trays'}</span>
      </span>
      <span className={`text-lg tabular-nums ${t.muted}`}>{fmt(pieces)} pcs</span>
    </div>
  );
}

export function KindTile({ kind, theme, bottleneck }: { kind: WipKind; theme: WallTheme; bottleneck: boolean }) {
  const t = THEMES[theme];
  const idle = kind.waiting.trays + kind.inProcess.trays + kind.curing.trays + kind.moulds === 0;
  const oven = kind.stationKind === 'cure';
  // An empty station looks quiet through a dashed outline, smaller figures and the word "Empty",
  // never through faded text: every word on the tile keeps its contrast (WCAG 2.1, 1.4.3).
  return (
    <section
      aria-label={kindName(kind.stationKind)}
      data-kind={kind.stationKind}
      className={`flex min-h-0 flex-col gap-1 rounded-2xl border-4 px-3 py-2 ${bottleneck ? t.tileHot : idle ? t.tileIdle : t.tile}`}
      data-idle={idle ? 'yes' : 'no'}
    >
      <h2 className={`truncate text-2xl font-bold ${t.strong}`}>{kindName(kind.stationKind)}</h2>
      {bottleneck && (
        <span className={`flex w-fit items-center gap-1 rounded-full px-2 text-lg font-bold ${t.badge}`}>
          <TrendingUp className="h-5 w-5" aria-hidden /> Bottleneck
        </span>
      )}
      {idle && !bottleneck && (
        <span className={`flex w-fit items-center gap-1 text-lg font-bold ${t.strong}`} data-testid="idle">
          <CircleDashed className="h-5 w-5" aria-hidden /> Empty
        </span>
      )}
      <div className="grid grid-cols-2 gap-2">
        <Figure theme={theme} testId="waiting" icon={<Hourglass className="h-5 w-5" aria-hidden />} label="Waiting" quiet={idle} trays={kind.waiting.trays} pieces={kind.waiting.pieces} />
        {oven ? (
          <Figure theme={theme} testId="curing" icon={<Flame className="h-5 w-5" aria-hidden />} label="Curing" quiet={idle} trays={kind.curing.trays} pieces={kind.curing.pieces} />
        ) : (
          <Figure theme={theme} testId="in-process" icon={<Wrench className="h-5 w-5" aria-hidden />} label="In process" quiet={idle} trays={kind.inProcess.trays} pieces={kind.inProcess.pieces} />
        )}
      </div>
      <footer className={`mt-auto flex flex-wrap items-center gap-x-3 text-lg ${t.muted}`}>
        <span className="flex items-center gap-1">
          <Clock className="h-5 w-5" aria-hidden /> Oldest <strong className={t.strong}>{kind.oldestMinutes == null ? 'none' : minutesText(kind.oldestMinutes)}</strong>
        </span>
        {kind.held > 0 && (
          <span className={`flex items-center gap-1 rounded-full px-2 font-bold ${t.stop}`}>
            <PauseCircle className="h-5 w-5" aria-hidden /> {kind.held} held
          </span>
        )}
        {kind.moulds > 0 && <span>{kind.moulds} {kind.moulds === 1 ? 'mould' : 'moulds'}</span>}
      </footer>
    </section>
  );
}

function Panel({ title, icon, children, theme, count }: { title: string; icon: ReactNode; children: ReactNode; theme: WallTheme; count?: number }) {
  const t = THEMES[theme];
  return (
    <section aria-label={title} className={`flex min-h-0 flex-1 flex-col rounded-2xl border-4 px-4 py-3 ${t.panel}`}>
      <h2 className={`mb-2 flex items-center gap-2 text-2xl font-bold ${t.strong}`}>
        {icon} {title}
        {count !== undefined && <span className={`ml-auto text-xl ${t.muted}`}>{count}</span>}
      </h2>
      <div className="min-h-0 overflow-hidden">{children}</div>
    </section>
  );
}

/** The whole floor on one screen: a tile per kind of work, and what needs someone's attention. */
export function WallBoard({ view, theme, compact = false }: { view: WallView; theme: WallTheme; compact?: boolean }) {
  const t = THEMES[theme];
  const now = useNow();
  const active = view.wip.kinds.filter((k) => k.stations.length > 0 || k.waiting.trays + k.inProcess.trays + k.curing.trays + k.moulds > 0);
  const tz = view.timeZone;
  return (
    <div className={`grid gap-4 ${compact ? 'grid-cols-1 xl:grid-cols-[1fr_420px]' : 'h-full grid-cols-[1fr_440px] grid-rows-[minmax(0,1fr)]'}`}>
      <div className={`grid gap-3 ${compact ? 'grid-cols-2 md:grid-cols-3 2xl:grid-cols-4' : 'min-h-0 grid-cols-5 grid-rows-4'}`}>
        {active.map((k) => (
          <KindTile key={k.stationKind} kind={k} theme={theme} bottleneck={view.bottleneck?.stationKind === k.stationKind} />
        ))}
      </div>
      <div className="flex min-h-0 flex-col gap-3">
        {view.bottleneck && (
          <p className={`rounded-2xl border-4 px-4 py-3 text-xl ${t.tileHot}`}>
            <TrendingUp className="mr-2 inline h-6 w-6" aria-hidden />
            Longest queue for its size: <strong>{kindName(view.bottleneck.stationKind)}</strong>, {view.bottleneck.waitingTrays} trays waiting, room for {view.bottleneck.capacityTrays} at a time.
          </p>
        )}
        <Panel theme={theme} title="Cure countdowns" icon={<Timer className="h-7 w-7" aria-hidden />} count={view.curing.length}>
          <ul className="flex flex-col gap-1 text-2xl">
            {view.curing.slice(0, 5).map((c) => {
              const left = Date.parse(c.readyAt) - now;
              return (
                <li key={c.trayId} className="flex justify-between gap-2">
                  <span className="font-bold">{c.number}</span>
                  <span className="tabular-nums">
                    {left <= 0 ? (
                      <span className="flex items-center gap-1 font-bold">
                        <PackageCheck className="h-6 w-6" aria-hidden /> Ready
                      </span>
                    ) : (
                      `${Math.floor(left / 60000)}:${String(Math.floor((left % 60000) / 1000)).padStart(2, '0')} left`
                    )}
                  </span>
                </li>
              );
            })}
            {view.curing.length === 0 && <li className={t.muted}>Nothing in the oven</li>}
          </ul>
        </Panel>
        <Panel theme={theme} title="Needs a supervisor" icon={<ShieldAlert className="h-7 w-7" aria-hidden />} count={view.refusals.length + view.holds.length}>
          <ul className="flex flex-col gap-1 text-xl">
            {view.refusals.slice(0, 3).map((r) => (
              <li key={r.id}>
                <AlertOctagon className="mr-1 inline h-5 w-5" aria-hidden />
                <strong>Refused</strong> {r.trayNumber ?? 'unknown tray'} at {r.stationName ?? 'a station'}: {r.message}
              </li>
            ))}
            {view.holds.slice(0, 3).map((h) => (
              <li key={h.trayId}>
                <PauseCircle className="mr-1 inline h-5 w-5" aria-hidden />
                <strong>On hold</strong> {h.number} at {kindName(h.stationKind)}
                {h.reason ? `: ${h.reason}` : ''}
              </li>
            ))}
            {view.overrides.slice(0, 2).map((o) => (
              <li key={o.id} className={t.muted}>
                <Hand className="mr-1 inline h-5 w-5" aria-hidden />
                Override {o.trayNumber} by {o.supervisorName ?? 'a supervisor'}: {o.reason}
              </li>
            ))}
            {view.refusals.length + view.holds.length + view.overrides.length === 0 && <li className={t.muted}>Nothing waiting for a decision</li>}
          </ul>
        </Panel>
        <Panel theme={theme} title="At risk of shipping late" icon={<AlertOctagon className="h-7 w-7" aria-hidden />} count={view.atRisk.length}>
          <ul className="flex flex-col gap-1 text-xl">
            {view.atRisk.slice(0, 3).map((o) => (
              <li key={o.orderId}>
                <strong>{o.number}</strong> {o.customer}: <strong>{o.risk === 'late' ? 'late' : 'at risk'}</strong>, due {o.dueDate}, expected {factoryTime(o.expectedAt, tz)}
              </li>
            ))}
            {view.atRisk.length === 0 && <li className={t.muted}>Every open order is on course</li>}
          </ul>
        </Panel>
      </div>
    </div>
  );
}
