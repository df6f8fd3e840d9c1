// An order's history line in the reader's language: the server stores each line's parameters
// beside its English text; a line kept before that (no parameters) stays as it was written.
import { useCallback } from 'react';
import { useTranslation } from 'react-i18next';
import type { HistoryEntry } from '@shared/schemas/orders';
import { formatDateTime, formatDueDay } from '@/lib/datetime';

type Key = 'history.order_resume';

export function useHistoryLine(): (h: HistoryEntry) => string {
  const { t, i18n } = useTranslation('orders');
  return useCallback(
    (h: HistoryEntry) => {
      const p = h.params;
      const base = h.action.replace(/\./g, '_');
      // a line with no parameters: its action's own words where there are some (a status link made
      // or withdrawn), else the text as it was stored
      if (!p) return i18n.exists(`orders:history.${base}`) ? t(`history.${base}` as Key) : h.text;
      const key = typeof p.variant === 'string' ? `${base}_${p.variant}` : base;
      if (!i18n.exists(`orders:history.${key}`)) return h.text;
      const values: Record<string, unknown> = { ...p };
      if (Array.isArray(p.fields)) values.fields = p.fields.map((f) => t(`history.field.${f}` as Key, { defaultValue: f })).join(t('history.fieldJoin'));
      if (typeof p.day === 'string') values.day = formatDueDay(p.day);
      let text = t(`history.${key}` as Key, values);
      if (h.action === 'order.release') {
        if (typeof p.since === 'string') text += t('history.releaseSince', { at: formatDateTime(p.since) });
        if (typeof p.moulds === 'number') text += t('history.releaseMoulds', { count: p.moulds });
        if (typeof p.reused === 'number' && p.reused > 0) text += t('history.releaseReused', { count: p.reused });
      }
      if (typeof p.note === 'string' && p.note) text = t('history.withNote', { text, note: p.note });
      return text;
    },
    [t, i18n],
  );
}
