import { z } from 'zod';
import { STATION_KINDS } from '../domain/vocabulary';

export const stationKindSchema = z.enum(STATION_KINDS);

export const stationBody = z.strictObject({
  code: z
    .string()
    .trim()
    .regex(/^[A-Z0-9-]{2,16}$/, 'Use 2 to 16 capital letters, digits or dashes.'),
  name: z.string().trim().min(1).max(80),
  nameZh: z.string().trim().max(80).default(''),
  kind: stationKindSchema,
  capacityTrays: z.number().int().min(1).max(500).default(1),
  continuous: z.boolean().default(false),
  instructions: z.string().max(4000).default(''),
  safetyNotes: z.string().max(4000).default(''),
  instructionsZh: z.string().max(4000).default(''),
  safetyNotesZh: z.string().max(4000).default(''),
  active: z.boolean().default(true),
});
export type StationBody = z.infer<typeof stationBody>;
export const updateStationBody = stationBody.partial();

export const stationView = z.object({
  id: z.string(),
  code: z.string(),
  name: z.string(),
  nameZh: z.string(),
  kind: stationKindSchema,
  capacityTrays: z.number(),
  continuous: z.boolean(),
  instructions: z.string(),
  safetyNotes: z.string(),
  instructionsZh: z.string(),
  safetyNotesZh: z.string(),
  active: z.boolean(),
});
export type StationView = z.infer<typeof stationView>;

export const reasonCodeView = z.object({
  code: z.string(),
  name: z.string(),
  nameZh: z.string(),
  kind: z.enum(['scrap', 'rework', 'hold']),
  stationKind: stationKindSchema.nullable().optional(),
});
export type ReasonCodeView = z.infer<typeof reasonCodeView>;

export const createDeviceBody = z.strictObject({
  name: z.string().trim().min(1).max(80),
  stationId: z.string().min(1).nullable(),
  locale: z.enum(['en', 'zh-CN']).default('en'),
  idleMinutes: z.number().int().min(1).max(240).default(10),
});
export type CreateDeviceBody = z.infer<typeof createDeviceBody>;

export const updateDeviceBody = z
  .strictObject({
    name: z.string().trim().min(1).max(80),
    stationId: z.string().min(1).nullable(),
    locale: z.enum(['en', 'zh-CN']),
    idleMinutes: z.number().int().min(1).max(240),
    active: z.boolean(),
  })
  .partial();

export const pairDeviceBody = z.strictObject({
  code: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z0-9]{6}$/, 'A pairing code is 6 letters and digits.'),
});

export const deviceView = z.object({
  id: z.string(),
  name: z.string(),
  kind: z.enum(['tablet', 'wall']),
  stationId: z.string().nullable(),
  locale: z.enum(['en', 'zh-CN']),
  idleMinutes: z.number(),
  active: z.boolean(),
  paired: z.boolean(),
  pairingCode: z.string().nullable(),
  lastSeenAt: z.string().nullable(),
});
export type DeviceView = z.infer<typeof deviceView>;
