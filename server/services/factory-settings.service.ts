// The factory's own settings kept under the `factory` key (its name, zone and print language):
// here the print language, which travellers and packing lists are printed in.
import type { AppDeps } from '../app-deps';
import type { DbLike } from '../db/client';
import { calendarRepository } from '../repositories/calendar.repository';
import { auditRepository } from '../repositories/audit.repository';
import { LOCALES, type Locale } from '@shared/domain/vocabulary';
import type { FactoryLanguage } from '@shared/schemas/admin';

function languageOf(db: DbLike): Locale {
  const stored = calendarRepository.factorySettings(db)?.language;
  return (LOCALES as readonly string[]).includes(stored ?? '') ? (stored as Locale) : 'en';
}

export const factorySettingsService = {
  /** English unless an admin chose Chinese. */
  language: (deps: AppDeps): Locale => languageOf(deps.db),

  view: (deps: AppDeps): FactoryLanguage => ({ language: languageOf(deps.db) }),

  setLanguage(deps: AppDeps, body: FactoryLanguage, actorId: string): FactoryLanguage {
    const now = deps.now();
    deps.db.transaction((tx) => {
      const current = calendarRepository.factorySettings(tx) ?? {};
      calendarRepository.saveFactorySettings(tx, { ...current, language: body.language });
      auditRepository.record(tx, now, {
        userId: actorId,
        action: 'settings.factory_language',
        entity: 'settings',
        entityId: 'factory',
        detail: { language: body.language },
      });
    });
    return { language: languageOf(deps.db) };
  },
};
