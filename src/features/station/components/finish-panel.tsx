import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import type { ReasonCodeView } from '@shared/schemas/stations';
import type { StationLang } from '../lib/refusal-text';
import { Stepper } from './stepper';
import { InActionBar, barButton } from './action-bar';

export interface FinishCounts {
  goodQty: number;
  scrapQty: number;
  reworkQty: number;
  scrapReason?: string;
}

/** Good, scrap and rework counts, preset to every piece good; a reason whenever something is scrapped. */
export function FinishPanel({
  quantity,
  reasons,
  lang,
  onConfirm,
  onCancel,
}: {
  quantity: number | null;
  reasons: ReasonCodeView[];
  lang: StationLang;
  onConfirm: (c: FinishCounts) => void;
  onCancel: () => void;
}) {
  const { t } = useTranslation('station');
  const qty = quantity ?? 0;
  const [good, setGood] = useState(qty);
  const [scrap, setScrap] = useState(0);
  const [rework, setRework] = useState(0);
  const [reason, setReason] = useState('');
  const addsUp = quantity == null || good + scrap === qty;
  const reasonOk = scrap === 0 || !!reason;
  const scrapReasons = reasons.filter((r) => r.kind === 'scrap' || r.kind === 'rework');
  return (
    <form
      id="finish-form"
      aria-labelledby="finish-title"
      className="flex flex-col gap-4 rounded-2xl border-2 border-harbour-800 bg-white p-5"
      onSubmit={(e) => {
        e.preventDefault();
        if (addsUp && reasonOk) onConfirm({ goodQty: good, scrapQty: scrap, reworkQty: Math.min(rework, good), ...(scrap > 0 ? { scrapReason: reason } : {}) });
      }}
    >
      <h2 id="finish-title" className="text-2xl font-bold">
        {t('finish.title')}
      </h2>
      <div className="flex flex-wrap gap-6">
        <Stepper id="good" label={t('finish.good')} value={good} max={Math.max(qty, good) || 100000} onChange={setGood} />
        <Stepper
          id="scrap"
          label={t('finish.scrap')}
          value={scrap}
          max={qty || 100000}
          onChange={(n) => {
            setScrap(n);
            if (quantity != null) setGood(Math.max(0, qty - n));
          }}
        />
        <Stepper id="rework" label={t('finish.rework')} value={rework} max={good} onChange={setRework} />
      </div>
      {quantity != null && (
        <p className={`text-xl font-bold ${addsUp ? 'text-ok-700' : 'text-stop-700'}`}>
          {t('finish.sum', { good, scrap, total: good + scrap, quantity: qty })} {addsUp ? '✓' : `✗ ${t('finish.mustAddUp')}`}
        </p>
      )}
      {scrap > 0 && (
        <div className="flex flex-col gap-2">
          <label htmlFor="scrap-reason" className="text-lg font-bold">
            {t('finish.reason')}
          </label>
          <select
            id="scrap-reason"
            value={reason}
            onChange={(e) => setReason(e.target.value)}
            className="min-h-14 rounded-xl border-2 border-harbour-800 bg-white px-3 text-xl"
          >
            <option value="">{t('finish.chooseReason')}</option>
            {scrapReasons.map((r) => (
              <option key={r.code} value={r.code}>
                {lang === 'zh-CN' ? r.nameZh : r.name}
              </option>
            ))}
          </select>
          {!reasonOk && <p className="font-bold text-stop-700">{t('finish.needReason')}</p>}
        </div>
      )}
      <InActionBar>
        <button type="submit" form="finish-form" disabled={!addsUp || !reasonOk} className={`${barButton('primary')} grow-[2]`}>
          {t('action.confirm')}
        </button>
        <button type="button" onClick={onCancel} className={barButton('plain')}>
          {t('action.cancel')}
        </button>
      </InActionBar>
    </form>
  );
}
