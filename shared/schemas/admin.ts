import { z } from 'zod';
import { stationKindSchema } from './stations';
import { localeSchema } from './auth';

export const reasonCodeBody = z.strictObject({
  code: z
    .string()
    .trim()
    .regex(/^[a-z][a-z0-9_]{1,39}$/, 'Use 2 to 40 lower-case letters, digits or underscores, starting with a letter.'),
  name: z.string().trim().min(1).max(80),
  nameZh: z.string().trim().min(1).max(80),
  kind: z.enum(['scrap', 'rework', 'hold']),
  stationKind: stationKindSchema.nullable().default(null),
  active: z.boolean().default(true),
});
export type ReasonCodeBody = z.infer<typeof reasonCodeBody>;
export const updateReasonCodeBody = reasonCodeBody.omit({ code: true }).partial();

export const reasonCodeAdminView = reasonCodeBody.extend({ stationKind: stationKindSchema.nullable() });
export type ReasonCodeAdminView = z.infer<typeof reasonCodeAdminView>;

export const backupView = z.object({ file: z.string(), sizeBytes: z.number(), createdAt: z.string() });
export type BackupView = z.infer<typeof backupView>;

/** `PUT /api/admin/factory-language`: the language travellers and packing lists print in */
export const factoryLanguageBody = z.strictObject({ language: localeSchema });
export type FactoryLanguage = z.infer<typeof factoryLanguageBody>;
