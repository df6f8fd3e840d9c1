import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import type { ReasonCodeView } from '@shared/schemas/stations';
import type { StationLang } from '../lib/refusal-text';
import { InActionBar, barButton } from './action-bar';

export function HoldPanel({
  reasons,
  lang,
  onConfirm,
  onCancel,
}: {
  reasons: ReasonCodeView[];
  lang: StationLang;
  onConfirm: (r: { scrapReason: string; note?: string }) => void;
  onCancel: () => void;
}) {
  const { t } = useTranslation('station');
  const holdReasons = reasons.filter((r) => r.kind === 'hold');
  const [reason, setReason] = useState(holdReasons[0]?.code ?? '');
  const [note, setNote] = useState('');
  return (
    <form
      id="hold-form"
      aria-labelledby="hold-title"
      className="flex flex-col gap-4 rounded-2xl border-2 border-warn-700 bg-white p-5"
      onSubmit={(e) => {
        e.preventDefault();
        if (reason) onConfirm({ scrapReason: reason, ...(note.trim() ? { note: note.trim() } : {}) });
      }}
    >
      <h2 id="hold-title" className="text-2xl font-bold">
        {t('hold.title')}
      </h2>
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-2 text-lg font-bold">{t('hold.reason')}</legend>
        {holdReasons.map((r) => (
          <label key={r.code} className="flex min-h-14 items-center gap-3 rounded-xl bg-warn-50 px-4 text-xl">
            <input type="radio" name="hold-reason" value={r.code} checked={reason === r.code} onChange={() => setReason(r.code)} className="h-6 w-6" />
            {lang === 'zh-CN' ? r.nameZh : r.name}
          </label>
        ))}
      </fieldset>
      <label htmlFor="hold-note" className="text-lg font-bold">
        {t('hold.note')}
      </label>
      <input id="hold-note" value={note} onChange={(e) => setNote(e.target.value)} className="min-h-14 rounded-xl border-2 border-harbour-800 px-3 text-xl" />
      <InActionBar>
        <button type="submit" form="hold-form" disabled={!reason} className={`${barButton('warn')} grow-[2]`}>
          {t('hold.confirm')}
        </button>
        <button type="button" onClick={onCancel} className={barButton('plain')}>
          {t('action.cancel')}
        </button>
      </InActionBar>
    </form>
  );
}
