import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { Languages, LogIn, UserRound } from 'lucide-react';
import { ApiError } from '@/lib/api-client';
import type { Role } from '@shared/domain/vocabulary';
import { badgeSignIn } from '../api/badge-sign-in';
import { stationDb } from '../lib/station-db';
import { checkPin, makePinVerifier, OFFLINE_SIGN_IN_HOURS } from '../lib/pin-verifier';
import { useLive, useWedgeScanner } from '../lib/hooks';
import { playFeedback, unlockAudio } from '../lib/feedback';
import { PinPad } from './pin-pad';
import type { StationLang } from '../lib/refusal-text';

export interface Operator {
  id: string;
  name: string;
  role: Role;
  badge: string;
  since: number;
  offline: boolean;
}

/** Badge, then PIN. Online the server checks them; offline, people who signed in here this shift can. */
export function SignInPanel({
  onSignedIn,
  stationName,
  lang,
  onToggleLang,
}: {
  onSignedIn: (op: Operator) => void;
  stationName: string;
  lang: StationLang;
  onToggleLang: () => void;
}) {
  const { t } = useTranslation('station');
  const db = stationDb();
  const [badge, setBadge] = useState('');
  const [step, setStep] = useState<'badge' | 'pin'>('badge');
  const [pin, setPin] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const known = useLive(() => db.operators.filter((o) => o.validUntil > Date.now()).toArray(), [], []);

  useWedgeScanner((text) => {
    setBadge(text.trim());
    setStep('pin');
    setError(null);
  }, step === 'badge');

  async function submit() {
    if (!badge || pin.length < 4) return;
    unlockAudio();
    setBusy(true);
    setError(null);
    try {
      const { user } = await badgeSignIn(badge, pin);
      try {
        const v = await makePinVerifier(pin);
        await db.operators.put({ badge, id: user.id, name: user.name, role: user.role, ...v, validUntil: Date.now() + OFFLINE_SIGN_IN_HOURS * 3600_000 });
      } catch {
        // no WebCrypto on an insecure page: only online sign-in then
      }
      onSignedIn({ id: user.id, name: user.name, role: user.role, badge, since: Date.now(), offline: false });
    } catch (e) {
      if (e instanceof ApiError && e.status === 0) {
        const k = await db.operators.get(badge);
        if (k && k.validUntil > Date.now() && (await checkPin(pin, k).catch(() => false))) {
          onSignedIn({ id: k.id, name: k.name, role: k.role, badge, since: Date.now(), offline: true });
          return;
        }
        setError(t('signIn.offlineUnknown'));
      } else if (e instanceof ApiError && e.status === 429) setError(t('signIn.throttled'));
      else setError(t('signIn.wrong'));
      playFeedback('refused');
      setPin('');
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="mx-auto grid max-w-4xl gap-8 p-6 md:grid-cols-2">
      <div className="flex flex-wrap items-center justify-between gap-3 md:col-span-2">
        <p className="text-2xl font-bold text-harbour-900" data-testid="station-name-sign-in">
          {stationName}
        </p>
        <button
          type="button"
          onClick={onToggleLang}
          lang={lang === 'en' ? 'zh-CN' : 'en'}
          className="flex min-h-14 shrink-0 items-center gap-2 whitespace-nowrap rounded-xl bg-white px-4 text-xl font-bold text-harbour-800 ring-2 ring-harbour-800"
          aria-label={`${t('app.language')}: ${lang === 'en' ? t('app.chinese') : t('app.english')}`}
        >
          <Languages className="h-6 w-6" aria-hidden /> {lang === 'en' ? t('app.chinese') : t('app.english')}
        </button>
      </div>
      <section aria-labelledby="sign-in-title" className="rounded-2xl bg-white p-6 shadow-sm">
        <h1 id="sign-in-title" className="mb-4 text-3xl font-bold text-harbour-900">
          {step === 'badge' ? t('signIn.badgePrompt') : t('signIn.pinPrompt')}
        </h1>
        {step === 'badge' ? (
          <form
            onSubmit={(e) => {
              e.preventDefault();
              if (badge.trim()) setStep('pin');
            }}
            className="flex flex-col gap-4"
          >
            <label htmlFor="badge" className="text-lg font-bold">
              {t('signIn.badge')}
            </label>
            <input
              id="badge"
              autoFocus
              autoComplete="off"
              value={badge}
              onChange={(e) => setBadge(e.target.value)}
              className="min-h-16 rounded-xl border-2 border-harbour-800 bg-white px-4 font-mono text-3xl"
            />
            <p className="text-harbour-700">{t('signIn.badgeHint')}</p>
            <button type="submit" className="min-h-16 rounded-xl bg-harbour-800 text-2xl font-bold text-white disabled:opacity-50" disabled={!badge.trim()}>
              {t('action.confirm')}
            </button>
          </form>
        ) : (
          <form
            onSubmit={(e) => {
              e.preventDefault();
              void submit();
            }}
            className="flex flex-col gap-4"
          >
            <p className="font-mono text-2xl">
              {t('signIn.badge')}: {badge}
            </p>
            <PinPad id="pin" value={pin} onChange={setPin} label={t('signIn.pin')} />
            <button
              type="submit"
              disabled={busy || pin.length < 4}
              className="flex min-h-20 items-center justify-center gap-3 rounded-xl bg-harbour-800 text-2xl font-bold text-white disabled:opacity-50"
            >
              <LogIn className="h-7 w-7" aria-hidden />
              {t('signIn.submit')}
            </button>
            <button
              type="button"
              onClick={() => {
                setStep('badge');
                setPin('');
                setBadge('');
                setError(null);
              }}
              className="min-h-14 rounded-xl bg-white text-lg font-bold text-harbour-800 ring-2 ring-harbour-100"
            >
              {t('signIn.back')}
            </button>
          </form>
        )}
        {error && (
          <p role="alert" className="mt-4 rounded-xl border-2 border-stop-700 bg-stop-50 p-4 text-lg font-bold text-stop-700">
            {error}
          </p>
        )}
      </section>
      {known.length > 0 && (
        <section aria-labelledby="recent-title" className="rounded-2xl bg-white p-6 shadow-sm">
          <h2 id="recent-title" className="mb-4 text-xl font-bold">
            {t('signIn.recent')}
          </h2>
          <ul className="flex flex-col gap-3">
            {known.map((k) => (
              <li key={k.badge}>
                <button
                  type="button"
                  onClick={() => {
                    setBadge(k.badge);
                    setStep('pin');
                    setPin('');
                    setError(null);
                  }}
                  className="flex min-h-16 w-full items-center gap-3 rounded-xl bg-harbour-50 px-4 text-left text-xl font-bold"
                >
                  <UserRound className="h-7 w-7" aria-hidden /> {k.name}
                </button>
              </li>
            ))}
          </ul>
        </section>
      )}
    </div>
  );
}
