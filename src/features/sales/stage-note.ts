// Where an order stands, in the reader's language, from the server's stage code and its numbers
// (the English `stageText` beside it in the answer is for other API users).
import { useCallback } from 'react';
import { useTranslation } from 'react-i18next';
import type { StageNote } from '@shared/domain/stages';

export function useStageNote(): (note: StageNote) => string {
  const { t, i18n } = useTranslation(['sales', 'portal', 'common']);
  const zh = i18n.language === 'zh-CN';
  // English names a station kind in lower case inside a sentence; Chinese has no case
  const lower = useCallback((x: string) => (zh ? x : x.toLowerCase()), [zh]);
  return useCallback(
    (note: StageNote) => {
      if (note.code !== 'in_stage') return t(`stageNote.${note.code}`);
      const p = note.params;
      const sentences = [t('stageNote.head', { stage: t(`portal:stages.${p.stage}`), explain: t(`stageNote.explain.${p.stage}`) })];
      const parts = p.at.map((a) => t('stageNote.at', { count: a.trays, kind: lower(t(`common:kind.${a.kind}`, { defaultValue: a.kind })) }));
      if (p.dispatched > 0) parts.push(t('stageNote.dispatched', { count: p.dispatched }));
      if (p.moulds > 0) parts.push(t('stageNote.moulds', { count: p.moulds }));
      if (parts.length > 0) {
        const joined = parts.join(t('stageNote.join'));
        sentences.push(t('stageNote.parts', { parts: joined.charAt(0).toUpperCase() + joined.slice(1) }));
      }
      if (p.orderOnHold) sentences.push(t('stageNote.orderOnHold'));
      else if (p.held > 0) sentences.push(t('stageNote.held', { count: p.held }));
      // Chinese sentences follow each other without a space
      return sentences.join(zh ? '' : ' ');
    },
    [t, zh, lower],
  );
}
