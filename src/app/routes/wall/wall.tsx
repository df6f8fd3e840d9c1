import { useEffect, useState } from 'react';
import { Moon, Radio, Sun, WifiOff } from 'lucide-react';
import type { WallView } from '@shared/schemas/live';
import { ApiError } from '@/lib/api-client';
import { useWall } from '@/features/live/api/get-wall';
import { usePairWall } from '@/features/live/api/wall-device';
import { useLiveWall } from '@/features/live/api/use-live-wall';
import { WallBoard, useNow, type WallTheme } from '@/features/live/components/wall-board';
import { factoryTime } from '@/lib/duration';
import { Button } from '@/components/ui/button';
import { ErrorPanel, Loading } from '@/components/ui/panels';

const THEME_KEY = 'trayce.wall.theme';

function PairPanel() {
  const pair = usePairWall();
  const [code, setCode] = useState('');
  return (
    <main className="mx-auto flex min-h-full max-w-xl flex-col justify-center gap-6 p-8">
      <h1 className="text-4xl font-bold text-harbour-900">Floor wall</h1>
      <p className="text-xl">
        This screen is not signed in. On <strong>Admin → Tablets &amp; walls</strong>, add a wall display (no station) and type its pairing code here. A supervisor or
        manager can also sign in on this screen.
      </p>
      <form
        className="flex flex-col gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          pair.mutate(code);
        }}
      >
        <label className="flex flex-col gap-1 text-lg font-bold">
          Pairing code
          <input
            value={code}
            onChange={(e) => setCode(e.target.value.toUpperCase())}
            autoComplete="off"
            className="min-h-14 rounded-lg border-2 border-harbour-100 bg-white px-3 text-2xl tracking-widest"
          />
        </label>
        <Button type="submit" size="lg" disabled={pair.isPending || code.trim().length < 4}>
          Pair this screen
        </Button>
        {pair.error && <ErrorPanel title="Not paired" message={pair.error.message} />}
      </form>
      <a className="text-lg font-bold text-harbour-700 underline" href="/sign-in?next=/wall">
        Sign in as a person instead
      </a>
    </main>
  );
}

function LiveWall({ view, theme, setTheme }: { view: WallView; theme: WallTheme; setTheme: (t: WallTheme) => void }) {
  const status = useLiveWall();
  const now = useNow();
  const dark = theme === 'dark';
  const totals = view.wip.totals;
  return (
    <div className={`flex h-screen flex-col gap-4 overflow-hidden p-5 ${dark ? 'bg-[#0b1a1e] text-white' : 'bg-paper text-ink'}`}>
      <header className="flex items-center gap-6">
        <h1 className="text-4xl font-bold">Floor now</h1>
        <span className="text-4xl font-bold tabular-nums" aria-label="Time at the factory">
          {factoryTime(new Date(now).toISOString(), view.timeZone, false)}
        </span>
        <span className="text-3xl">
          <strong>{totals.trays.toLocaleString('en-GB')}</strong> trays · <strong>{totals.pieces.toLocaleString('en-GB')}</strong> pieces ·{' '}
          <strong>{totals.moulds}</strong> moulds on the floor
        </span>
        <span role="status" className="ml-auto flex items-center gap-2 text-3xl font-bold" data-testid="stream-status">
          {status === 'live' ? (
            <>
              <Radio className="h-7 w-7" aria-hidden /> Live
            </>
          ) : (
            <>
              <WifiOff className="h-7 w-7" aria-hidden /> {status === 'connecting' ? 'Connecting…' : 'Reconnecting…'}
            </>
          )}
        </span>
        <button
          type="button"
          onClick={() => setTheme(dark ? 'light' : 'dark')}
          className={`flex min-h-14 items-center gap-2 rounded-xl border-2 px-4 text-3xl font-bold ${dark ? 'border-[#2b4a52]' : 'border-harbour-100'}`}
        >
          {dark ? <Sun className="h-6 w-6" aria-hidden /> : <Moon className="h-6 w-6" aria-hidden />}
          {dark ? 'Light screen' : 'Dark screen'}
        </button>
      </header>
      <div className="min-h-0 flex-1">
        <WallBoard view={view} theme={theme} />
      </div>
    </div>
  );
}

export function Component() {
  const wall = useWall();
  const [theme, setThemeState] = useState<WallTheme>(() => (localStorage.getItem(THEME_KEY) as WallTheme | null) ?? 'dark');
  const setTheme = (t: WallTheme) => {
    localStorage.setItem(THEME_KEY, t);
    setThemeState(t);
  };
  useEffect(() => {
    document.title = 'Floor wall · Trayce';
  }, []);
  if (wall.isPending) return <Loading label="Opening the floor wall…" />;
  if (wall.error) {
    if (wall.error instanceof ApiError && wall.error.status === 401) return <PairPanel />;
    if (wall.error instanceof ApiError && wall.error.status === 403)
      return (
        <main className="p-8">
          <ErrorPanel title="Not for this role" message="The floor wall is for supervisors, office staff and paired wall displays." />
        </main>
      );
    return (
      <main className="p-8">
        <ErrorPanel message={wall.error.message} />
      </main>
    );
  }
  return <LiveWall view={wall.data} theme={theme} setTheme={setTheme} />;
}
