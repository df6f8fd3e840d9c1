import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { ShieldCheck } from 'lucide-react';
import { ApiError } from '@/lib/api-client';
import type { OverrideView } from '@shared/schemas/scans';
import { createOverride } from '../api/create-override';
import { PinPad } from './pin-pad';
import { InActionBar, barButton } from './action-bar';

/** A supervisor approves one scan on this tablet with badge, PIN and a reason; the server records it. */
export function OverridePanel({
  kind,
  code,
  stationId,
  online,
  onApproved,
  onCancel,
}: {
  kind: 'wrong_station' | 'curing' | 'release';
  code: string;
  stationId: string;
  online: boolean;
  onApproved: (o: OverrideView) => void;
  onCancel: () => void;
}) {
  const { t } = useTranslation('station');
  const [badge, setBadge] = useState('');
  const [pin, setPin] = useState('');
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  return (
    <form
      id="override-form"
      aria-labelledby="override-title"
      className="flex flex-col gap-4 rounded-2xl border-2 border-brass-700 bg-white p-5"
      onSubmit={async (e) => {
        e.preventDefault();
        setBusy(true);
        setError(null);
        try {
          onApproved(await createOverride({ badge: badge.trim(), pin, reason: reason.trim(), code, stationId, kind }));
        } catch (err) {
          if (err instanceof ApiError && err.status === 0) setError(t('override.needsNetwork'));
          // a wrong badge, a wrong PIN and a badge that may not approve get one answer from the server
          else if (err instanceof ApiError && err.status === 401) setError(t('override.notSupervisor'));
          else if (err instanceof ApiError && err.status === 409 && err.code === 'station_not_allowed') setError(t('override.otherStation'));
          else if (err instanceof ApiError && err.status === 429) setError(t('signIn.throttled'));
          else setError(t('signIn.wrong'));
          setPin('');
        } finally {
          setBusy(false);
        }
      }}
    >
      <h2 id="override-title" className="flex items-center gap-2 text-2xl font-bold">
        <ShieldCheck className="h-8 w-8" aria-hidden /> {t('override.title')}
      </h2>
      <p className="text-lg">{t('override.intro')}</p>
      {!online && <p className="rounded-xl bg-warn-50 p-3 text-lg font-bold text-warn-700">{t('override.needsNetwork')}</p>}
      <label htmlFor="override-badge" className="text-lg font-bold">
        {t('override.badge')}
      </label>
      <input
        id="override-badge"
        autoComplete="off"
        value={badge}
        onChange={(e) => setBadge(e.target.value)}
        className="min-h-14 rounded-xl border-2 border-harbour-800 px-3 font-mono text-2xl"
      />
      <PinPad id="override-pin" label={t('override.pin')} value={pin} onChange={setPin} />
      <label htmlFor="override-reason" className="text-lg font-bold">
        {t('override.reason')}
      </label>
      <input
        id="override-reason"
        placeholder={t('override.reasonHint')}
        value={reason}
        onChange={(e) => setReason(e.target.value)}
        className="min-h-14 rounded-xl border-2 border-harbour-800 px-3 text-xl"
      />
      {error && (
        <p role="alert" className="rounded-xl border-2 border-stop-700 bg-stop-50 p-3 text-lg font-bold text-stop-700">
          {error}
        </p>
      )}
      <InActionBar>
        <button
          type="submit"
          form="override-form"
          disabled={busy || !badge.trim() || pin.length < 4 || reason.trim().length < 3}
          className={`${barButton('brass')} grow-[2]`}
        >
          {t('override.confirm')}
        </button>
        <button type="button" onClick={onCancel} className={barButton('plain')}>
          {t('action.cancel')}
        </button>
      </InActionBar>
    </form>
  );
}
