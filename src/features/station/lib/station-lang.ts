import type { StationLang } from './refusal-text';

export const isStationLang = (v: unknown): v is StationLang => v === 'en' || v === 'zh-CN';

/**
 * The language the tablet speaks to a person. What the person chose counts first: the choice saved
 * with their account on the server, then the one this tablet remembers for them (it also works
 * offline); the tablet's own setting is only the default for people who never chose.
 */
export function personLang(p: { server?: unknown; remembered?: unknown; tablet: StationLang }): StationLang {
  if (isStationLang(p.server)) return p.server;
  if (isStationLang(p.remembered)) return p.remembered;
  return p.tablet;
}

/** Station texts in the tablet's language; a Chinese text left empty falls back to the English one. */
export interface StationTexts {
  name: string;
  nameZh?: string;
  instructions: string;
  instructionsZh?: string;
  safetyNotes: string;
  safetyNotesZh?: string;
}

export function stationTexts(s: StationTexts, lang: StationLang): { name: string; instructions: string; safetyNotes: string } {
  const pick = (en: string, zh: string | undefined) => (lang === 'zh-CN' && zh?.trim() ? zh : en);
  return { name: pick(s.name, s.nameZh), instructions: pick(s.instructions, s.instructionsZh), safetyNotes: pick(s.safetyNotes, s.safetyNotesZh) };
}

export const langMetaKey = (userId: string) => `lang:${userId}`;
