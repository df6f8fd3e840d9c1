import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { Link } from 'react-router';
import { TabletSmartphone } from 'lucide-react';
import { ApiError } from '@/lib/api-client';
import { paths } from '@/config/paths';
import { usePairDevice } from '../api/pair-device';

/** The tablet types the code an administrator got when registering it; it then keeps its own token. */
export function PairScreen() {
  const { t } = useTranslation('station');
  const pair = usePairDevice();
  const [code, setCode] = useState('');
  const done = pair.data?.device;
  return (
    <main className="mx-auto flex min-h-full max-w-xl flex-col justify-center gap-6 p-6">
      <h1 className="flex items-center gap-3 text-3xl font-bold text-harbour-900">
        <TabletSmartphone className="h-9 w-9" aria-hidden /> {t('pair.title')}
      </h1>
      <p className="text-lg text-harbour-700">{t('pair.intro')}</p>
      {done ? (
        <div role="status" className="rounded-2xl border-2 border-ok-700 bg-ok-50 p-6 text-xl font-bold text-ok-700">
          <p>{t('pair.done', { station: done.name })}</p>
          <Link to={paths.station} className="mt-4 inline-flex min-h-14 items-center rounded-xl bg-harbour-800 px-6 text-white">
            {t('top.station')}
          </Link>
        </div>
      ) : (
        <form
          className="flex flex-col gap-4 rounded-2xl bg-white p-6 shadow-sm"
          onSubmit={(e) => {
            e.preventDefault();
            pair.mutate(code.trim().toUpperCase());
          }}
        >
          <label htmlFor="pairing-code" className="text-lg font-bold">
            {t('pair.code')}
          </label>
          <input
            id="pairing-code"
            autoFocus
            autoComplete="off"
            autoCapitalize="characters"
            maxLength={6}
            value={code}
            onChange={(e) => setCode(e.target.value.toUpperCase())}
            className="min-h-16 rounded-xl border-2 border-harbour-800 px-4 text-center font-mono text-4xl tracking-[0.4em] uppercase"
          />
          <button
            type="submit"
            disabled={code.trim().length !== 6 || pair.isPending}
            className="min-h-16 rounded-xl bg-harbour-800 text-2xl font-bold text-white disabled:opacity-50"
          >
            {pair.isPending ? t('pair.working') : t('pair.submit')}
          </button>
          {pair.error && (
            <p role="alert" className="rounded-xl border-2 border-stop-700 bg-stop-50 p-4 font-bold text-stop-700">
              {pair.error instanceof ApiError && pair.error.status === 404 ? t('pair.wrongCode') : pair.error.message}
            </p>
          )}
        </form>
      )}
    </main>
  );
}
