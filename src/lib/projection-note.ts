// How a projected ship date was found, said in the reader's language from the server's code and
// numbers (the English line beside it in the answer is for other API users).
import { useCallback } from 'react';
import { useTranslation } from 'react-i18next';
import { roundHours, type ProjectionNote } from '@shared/domain/projection-note';
import { formatDayTime } from '@/lib/datetime';

export function useProjectionNote(): (note: ProjectionNote) => string {
  const { t, i18n } = useTranslation(['projections', 'common']);
  // Chinese sentences follow each other without a space
  const zh = i18n.language === 'zh-CN';
  const sep = zh ? '' : ' ';
  // English names a station kind in lower case inside a sentence; Chinese has no case
  const lower = useCallback((x: string) => (zh ? x : x.toLowerCase()), [zh]);
  return useCallback(
    (note: ProjectionNote) => {
      switch (note.code) {
        case 'none':
        case 'all_done':
        case 'after_release':
          return t(`note.${note.code}`);
        case 'simple':
          return t('note.simple', { minutes: note.params.queueMinutes });
        case 'measured': {
          const p = note.params;
          const parts = [
            t('note.measured', { expected: formatDayTime(p.expectedAt), p85: formatDayTime(p.p85At), runs: p.runs, days: p.historyDays }),
            t('note.work', { count: p.remainingSteps, hours: roundHours(p.standardMinutes) }),
          ];
          if (p.drivingKind)
            parts.push(
              t('note.wait', {
                kind: lower(t(`common:kind.${p.drivingKind}`, { defaultValue: p.drivingKind })),
                hours: roundHours(p.drivingWaitMinutes),
              }),
            );
          if (p.traysOnHold > 0) parts.push(t('note.held', { count: p.traysOnHold }));
          return parts.join(sep);
        }
      }
    },
    [t, sep, lower],
  );
}
