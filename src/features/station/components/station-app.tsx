import { useCallback, useEffect, useMemo, useState } from 'react';
import { useTranslation } from 'react-i18next';
import { Link } from 'react-router';
import { useQueryClient } from '@tanstack/react-query';
import { Loader2, TabletSmartphone } from 'lucide-react';
import { paths } from '@/config/paths';
import type { StationQueue } from '@shared/schemas/scans';
import { useCurrentDevice } from '../api/get-current-device';
import { useStationQueue } from '../api/get-station-queue';
import { useReasonCodes } from '../api/get-reason-codes';
import { fetchMyLocale, saveMyLocale, signOutSession } from '../api/badge-sign-in';
import { httpTransport } from '../api/scan-transport';
import { stationKeys } from '../api/station-keys';
import { stationDb } from '../lib/station-db';
import { SyncEngine } from '../lib/sync-engine';
import { useLive } from '../lib/hooks';
import { setStationLang } from '../i18n/station-i18n';
import type { StationLang } from '../lib/refusal-text';
import { isStationLang, langMetaKey, personLang, stationTexts } from '../lib/station-lang';
import { SignInPanel, type Operator } from './sign-in-panel';
import { StationScreen } from './station-screen';
import type { StationInfo } from './tray-panel';

const OPERATOR_KEY = 'operator';
const SESSION_HOURS = 12;

let sharedEngine: SyncEngine | null = null;
/** One outbox loop per tab, whatever React does with mounts. */
function engineOnce(): SyncEngine {
  sharedEngine ??= new SyncEngine(stationDb(), httpTransport);
  return sharedEngine;
}

function Centered({ children }: { children: React.ReactNode }) {
  return <main className="mx-auto flex min-h-full max-w-xl flex-col items-center justify-center gap-6 p-6 text-center text-xl">{children}</main>;
}

/** The station tablet: which station it is, who is signed in, and the station screen. Works offline once loaded. */
export function StationApp() {
  const { t } = useTranslation('station');
  const db = stationDb();
  const qc = useQueryClient();
  const device = useCurrentDevice();
  const engine = useMemo(engineOnce, []);
  const [operator, setOperator] = useState<Operator | null | undefined>(undefined);
  const paired = device.data?.state === 'paired' ? device.data.device : null;
  const station = paired?.station ?? null;
  // The tablet's own language is the default; a person's choice is kept for that person.
  const tabletLang: StationLang = paired?.locale === 'zh-CN' ? 'zh-CN' : 'en';
  const [screenLang, setScreenLang] = useState<StationLang | null>(null);
  /** what the signed-in person chose (kept on the tablet per person, and with their account) */
  const [personChoice, setPersonChoice] = useState<StationLang | null>(null);
  const lang: StationLang = operator ? personLang({ remembered: personChoice, tablet: tabletLang }) : (screenLang ?? tabletLang);
  const queue = useStationQueue(station?.id ?? '');
  const reasons = useReasonCodes();
  const cachedInfo = useLive(() => db.getMeta<StationQueue['station']>('stationInfo'), [], undefined);

  useEffect(() => setStationLang(lang), [lang]);

  useEffect(() => {
    void engine.init().then(() => engine.start());
    const off = engine.onSynced(() => {
      if (station) void qc.invalidateQueries({ queryKey: stationKeys.queue(station.id) });
    });
    return () => {
      off();
    };
  }, [engine, qc, station]);

  useEffect(() => {
    void db.getMeta<Operator | null>(OPERATOR_KEY).then(async (op) => {
      const current = op && op.since > Date.now() - SESSION_HOURS * 3600_000 ? op : null;
      if (current) setPersonChoice((await db.getMeta<StationLang>(langMetaKey(current.id))) ?? null);
      setOperator(current);
    });
  }, [db]);

  const signIn = useCallback(
    async (op: Operator) => {
      // A language picked on the sign-in screen is this person's choice; otherwise the one saved
      // with their account, else the one this tablet remembers for them.
      let chosen: StationLang | null = screenLang;
      if (chosen) {
        if (!op.offline) void saveMyLocale(chosen).catch(() => undefined);
      } else {
        const saved = op.offline ? undefined : await fetchMyLocale().catch(() => undefined);
        chosen = isStationLang(saved) ? saved : ((await db.getMeta<StationLang>(langMetaKey(op.id))) ?? null);
      }
      if (chosen) await db.setMeta(langMetaKey(op.id), chosen);
      setPersonChoice(chosen);
      setScreenLang(null);
      setOperator(op);
      void db.setMeta(OPERATOR_KEY, op);
    },
    [db, screenLang],
  );
  const toggleLang = useCallback(() => {
    const next: StationLang = lang === 'en' ? 'zh-CN' : 'en';
    if (!operator) {
      setScreenLang(next);
      return;
    }
    setPersonChoice(next);
    void db.setMeta(langMetaKey(operator.id), next);
    void saveMyLocale(next).catch(() => undefined);
  }, [db, lang, operator]);
  const signOut = useCallback(() => {
    setScreenLang(null);
    setPersonChoice(null);
    setOperator(null);
    void db.setMeta(OPERATOR_KEY, null);
    // the server session ends too when the server can be reached; scans already made keep their operator
    void signOutSession().catch(() => undefined);
  }, [db]);

  if (device.isPending || operator === undefined) {
    return (
      <Centered>
        <Loader2 className="h-10 w-10 animate-spin" aria-hidden />
        <p role="status">{t('app.loading')}</p>
      </Centered>
    );
  }
  if (!paired || device.error) {
    return (
      <Centered>
        <TabletSmartphone className="h-14 w-14" aria-hidden />
        <p className="font-bold">{t('pair.notPaired')}</p>
        <Link to={paths.pair} className="inline-flex min-h-16 items-center rounded-2xl bg-harbour-800 px-8 text-2xl font-bold text-white">
          {t('pair.goPair')}
        </Link>
      </Centered>
    );
  }
  if (!station) {
    return (
      <Centered>
        <p className="font-bold">{t('pair.noStation')}</p>
      </Centered>
    );
  }
  const info: StationInfo = queue.data?.station ?? (cachedInfo?.id === station.id ? cachedInfo : null) ?? { ...station, instructions: '', safetyNotes: '' };
  if (!operator) return <SignInPanel stationName={stationTexts(info, lang).name} lang={lang} onToggleLang={toggleLang} onSignedIn={(op) => void signIn(op)} />;
  return (
    <StationScreen
      station={info}
      operator={operator}
      engine={engine}
      lang={lang}
      idleMinutes={paired.idleMinutes}
      reasons={reasons.data ?? []}
      onSignOut={signOut}
      onSwitch={signOut}
      onToggleLang={toggleLang}
    />
  );
}
