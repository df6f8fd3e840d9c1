import { useEffect, useState } from 'react';
import { Trans, useTranslation } from 'react-i18next';
import { useQuery } from '@tanstack/react-query';
import { Moon, Radio, Sun, WifiOff } from 'lucide-react';
import type { WallView } from '@shared/schemas/live';
import { ApiError } from '@/lib/api-client';
import { useWall } from '@/features/live/api/get-wall';
import { usePairWall, useWallDevice } from '@/features/live/api/wall-device';
import { meQueryOptions } from '@/features/auth/api/get-me';
import { applyLocale } from '@/lib/i18n';
import { useLiveWall } from '@/features/live/api/use-live-wall';
import { WallBoard, useNow, type WallTheme } from '@/features/live/components/wall-board';
import { factoryTime } from '@/lib/duration';
import { Button } from '@/components/ui/button';
import { ErrorPanel, Loading } from '@/components/ui/panels';

const THEME_KEY = 'trayce.wall.theme';

function PairPanel() {
  const { t } = useTranslation('live');
  const pair = usePairWall();
  const [code, setCode] = useState('');
  return (
    <main className="mx-auto flex min-h-full max-w-xl flex-col justify-center gap-6 p-8">
      <h1 className="text-4xl font-bold text-harbour-900">{t('wall.pairTitle')}</h1>
      <p className="text-xl">
        <Trans t={t} i18nKey="wall.pairIntro" components={{ strong: <strong /> }} />
      </p>
      <form
        className="flex flex-col gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          pair.mutate(code);
        }}
      >
        <label className="flex flex-col gap-1 text-lg font-bold">
          {t('wall.pairingCode')}
          <input
            value={code}
            onChange={(e) => setCode(e.target.value.toUpperCase())}
            autoComplete="off"
            className="min-h-14 rounded-lg border-2 border-harbour-100 bg-white px-3 text-2xl tracking-widest"
          />
        </label>
        <Button type="submit" size="lg" disabled={pair.isPending || code.trim().length < 4}>
          {t('wall.pair')}
        </Button>
        {pair.error && <ErrorPanel title={t('wall.notPaired')} message={pair.error.message} />}
      </form>
      <a className="text-lg font-bold text-harbour-700 underline" href="/sign-in?next=/wall">
        {t('wall.signInInstead')}
      </a>
    </main>
  );
}

function LiveWall({ view, theme, setTheme }: { view: WallView; theme: WallTheme; setTheme: (t: WallTheme) => void }) {
  const { t } = useTranslation('live');
  const status = useLiveWall();
  const now = useNow();
  const dark = theme === 'dark';
  const totals = view.wip.totals;
  return (
    <div className={`flex h-screen flex-col gap-4 overflow-hidden p-5 ${dark ? 'bg-[#0b1a1e] text-white' : 'bg-paper text-ink'}`}>
      <header className="flex items-center gap-6">
        <h1 className="text-4xl font-bold">{t('wall.heading')}</h1>
        <span className="text-4xl font-bold tabular-nums" aria-label={t('wall.clockLabel')}>
          {factoryTime(new Date(now).toISOString(), view.timeZone, false)}
        </span>
        <span className="text-3xl">
          <Trans
            t={t}
            i18nKey="wall.totals"
            values={{ trays: totals.trays.toLocaleString('en-GB'), pieces: totals.pieces.toLocaleString('en-GB'), moulds: totals.moulds }}
            components={{ strong: <strong /> }}
          />
        </span>
        <span role="status" className="ml-auto flex items-center gap-2 text-3xl font-bold" data-testid="stream-status">
          {status === 'live' ? (
            <>
              <Radio className="h-7 w-7" aria-hidden /> {t('wall.live')}
            </>
          ) : (
            <>
              <WifiOff className="h-7 w-7" aria-hidden /> {status === 'connecting' ? t('wall.connecting') : t('wall.reconnecting')}
            </>
          )}
        </span>
        <button
          type="button"
          onClick={() => setTheme(dark ? 'light' : 'dark')}
          className={`flex min-h-14 items-center gap-2 rounded-xl border-2 px-4 text-3xl font-bold ${dark ? 'border-[#2b4a52]' : 'border-harbour-100'}`}
        >
          {dark ? <Sun className="h-6 w-6" aria-hidden /> : <Moon className="h-6 w-6" aria-hidden />}
          {dark ? t('wall.lightScreen') : t('wall.darkScreen')}
        </button>
      </header>
      <div className="min-h-0 flex-1">
        <WallBoard view={view} theme={theme} />
      </div>
    </div>
  );
}

/**
 * The wall speaks the language its display was given on Admin → Tablets & walls; when a person
 * opens it in their own browser (no paired display), that person's language.
 */
function useWallLocale() {
  const device = useWallDevice();
  const person = useQuery({ ...meQueryOptions(), enabled: device.isSuccess && !device.data });
  const locale = device.data?.locale ?? person.data?.user.locale;
  useEffect(() => {
    if (locale) applyLocale(locale);
  }, [locale]);
}

export function Component() {
  const { t } = useTranslation('live');
  useWallLocale();
  const wall = useWall();
  const [theme, setThemeState] = useState<WallTheme>(() => (localStorage.getItem(THEME_KEY) as WallTheme | null) ?? 'dark');
  const setTheme = (t: WallTheme) => {
    localStorage.setItem(THEME_KEY, t);
    setThemeState(t);
  };
  useEffect(() => {
    document.title = t('wall.pageTitle');
  }, [t]);
  if (wall.isPending) return <Loading label={t('wall.opening')} />;
  if (wall.error) {
    if (wall.error instanceof ApiError && wall.error.status === 401) return <PairPanel />;
    if (wall.error instanceof ApiError && wall.error.status === 403)
      return (
        <main className="p-8">
          <ErrorPanel title={t('wall.notForRole')} message={t('wall.notForRoleText')} />
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
