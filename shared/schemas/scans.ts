import { z } from 'zod';
import { REJECTION_CODES, SCAN_TYPES, STATION_KINDS, TRAY_PHASES } from '../domain/vocabulary';

/** Most events one POST /api/scans may carry. */
export const MAX_SCAN_BATCH = 500;

const count = z.int().min(0).max(1_000_000);

/** One scan made on a tablet. The id is made on the device, so sending it twice changes nothing. */
export const scanEventSchema = z.object({
  id: z.uuid(),
  /** the QR text or the human-readable tray number */
  code: z.string().trim().min(1).max(256),
  stationId: z.string().min(1).max(64),
  type: z.enum(SCAN_TYPES),
  /** device clock corrected by the device's measured offset; UTC ISO 8601 */
  occurredAt: z.iso.datetime({ offset: true }),
  goodQty: count.optional(),
  scrapQty: count.optional(),
  /** pieces reworked at this step that ended up good: part of goodQty, kept apart for first-pass yield */
  reworkQty: count.optional(),
  /** reason code (scrap reason on a finish, hold reason on a hold) */
  scrapReason: z.string().trim().min(1).max(64).optional(),
  overrideId: z.string().min(1).max(64).optional(),
  note: z.string().max(1000).optional(),
  /**
   * Who scanned, for events queued offline on a shared tablet while operators switched.
   * Only honoured for a paired device and a user who signed in on that device; otherwise the
   * signed-in user is the operator.
   */
  operatorId: z.string().min(1).max(64).optional(),
});
export type ScanEvent = z.infer<typeof scanEventSchema>;

/**
 * The batch envelope. Events are checked one by one after this (a malformed event is answered
 * `rejected` / `invalid_event` in its place, it never fails the others), so the envelope only
 * asks for 1..500 objects.
 */
export const scanBatchEnvelopeSchema = z.object({
  events: z.array(z.looseObject({})).min(1).max(MAX_SCAN_BATCH),
});

/** The strict batch body, as a tablet builds it. */
export const scanBatchSchema = z.object({
  events: z.array(scanEventSchema).min(1).max(MAX_SCAN_BATCH),
});
export type ScanBatch = z.infer<typeof scanBatchSchema>;

export const SCAN_RESULT_STATUSES = ['accepted', 'duplicate', 'rejected'] as const;
export type ScanResultStatus = (typeof SCAN_RESULT_STATUSES)[number];

/** The traveller after the event (or as it stands, for a refusal). */
export const scanTraySchema = z.object({
  id: z.string(),
  number: z.string(),
  kind: z.enum(['tray', 'mould']),
  phase: z.enum(TRAY_PHASES),
  stepSeq: z.int().nullable(),
  stepName: z.string().nullable(),
  quantity: z.int(),
  onHold: z.boolean(),
  cureReadyAt: z.string().nullable(),
});
export type ScanTray = z.infer<typeof scanTraySchema>;

export const refusalParamsSchema = z.record(z.string(), z.union([z.string(), z.number(), z.null()]));

export const scanResultSchema = z.object({
  id: z.string(),
  status: z.enum(SCAN_RESULT_STATUSES),
  code: z.enum(REJECTION_CODES).optional(),
  /** plain English: what happened and what to do next */
  message: z.string().optional(),
  /** for `curing`: whole minutes until the cure has run its time */
  minutesLeft: z.int().optional(),
  /** the values the message was made from, so a tablet can say it in its own language */
  params: refusalParamsSchema.optional(),
  tray: scanTraySchema.optional(),
});
export type ScanResult = z.infer<typeof scanResultSchema>;

export const scanBatchResponseSchema = z.object({
  results: z.array(scanResultSchema),
  /** the server clock when it answered, for the tablet's clock-offset estimate */
  serverTime: z.string(),
});
export type ScanBatchResponse = z.infer<typeof scanBatchResponseSchema>;

// ---------------------------------------------------------------------------------------------
// Supervisor overrides, station queues, refused-scan lists

export const overrideBody = z.strictObject({
  badge: z.string().trim().min(1).max(64),
  pin: z.string().regex(/^\d{4,8}$/, 'A PIN is 4 to 8 digits.'),
  reason: z.string().trim().min(3, 'Say why in a few words.').max(500),
  /** the scanned traveller code or tray number */
  code: z.string().trim().min(1).max(256),
  stationId: z.string().min(1).max(64),
  kind: z.enum(['wrong_station', 'curing', 'release']),
});
export type OverrideBody = z.infer<typeof overrideBody>;

export const overrideView = z.object({
  id: z.string(),
  /** the one guard it lets through, at `stationId`, for one scan */
  kind: z.enum(['wrong_station', 'curing', 'release']),
  stationId: z.string(),
  supervisor: z.object({ id: z.string(), name: z.string() }),
  expiresAt: z.string(),
});
export type OverrideView = z.infer<typeof overrideView>;

const routingStepWire = z.object({
  seq: z.int(),
  name: z.string(),
  stationKind: z.enum(STATION_KINDS),
  trayMinutes: z.number(),
  pieceMinutes: z.number(),
  cureMinutes: z.number().nullable().optional(),
  colour: z.int().nullable().optional(),
});

const trayStateWire = z.object({
  trayId: z.string(),
  kind: z.enum(['tray', 'mould']),
  phase: z.enum(TRAY_PHASES),
  stepSeq: z.int().nullable(),
  quantity: z.int(),
  stationId: z.string().nullable(),
  startedAt: z.string().nullable(),
  waitingSince: z.string().nullable(),
  cureReadyAt: z.string().nullable(),
  onHold: z.boolean(),
  holdReason: z.string().nullable(),
  releasedAt: z.string(),
  lastEventAt: z.string().nullable().optional(),
});

/** Everything a tablet shows about a traveller and needs to run the guards offline. */
export const trayCardSchema = z.object({
  tray: z.object({ id: z.string(), number: z.string(), kind: z.enum(['tray', 'mould']), revision: z.int(), releasedQuantity: z.int() }),
  order: z
    .object({
      id: z.string(),
      number: z.string(),
      title: z.string(),
      customer: z.string(),
      process: z.string(),
      material: z.string(),
      sizeMm: z.number(),
      colours: z.array(z.object({ name: z.string(), ref: z.string().optional(), hex: z.string().optional() })),
      plating: z.string(),
      backingType: z.string(),
      backingCount: z.int(),
      packaging: z.string(),
      dueDate: z.string(),
      notes: z.string(),
    })
    .nullable(),
  state: trayStateWire,
  routing: z.array(routingStepWire),
  /** whether the order's moulds are ready (striking and casting wait for them) */
  mouldReady: z.boolean(),
  artworkUrl: z.string().nullable(),
});
export type TrayCard = z.infer<typeof trayCardSchema>;

export const stationQueueSchema = z.object({
  station: z.object({
    id: z.string(),
    code: z.string(),
    name: z.string(),
    /** older tablets' cached copies lack the Chinese texts */
    nameZh: z.string().default(''),
    kind: z.enum(STATION_KINDS),
    continuous: z.boolean(),
    instructions: z.string(),
    safetyNotes: z.string(),
    instructionsZh: z.string().default(''),
    safetyNotesZh: z.string().default(''),
  }),
  asOf: z.string(),
  trays: z.array(trayCardSchema),
});
export type StationQueue = z.infer<typeof stationQueueSchema>;

export const exceptionsQuery = z.object({
  open: z.enum(['true', 'false', 'all']).default('true'),
  sinceHours: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 90)
    .optional(),
  limit: z.coerce.number().int().min(1).max(1000).default(200),
});

export const resolveExceptionBody = z.strictObject({
  resolution: z.string().trim().min(3, 'Say what was done in a few words.').max(500),
});

export const scanExceptionView = z.object({
  id: z.string(),
  eventId: z.string(),
  code: z.enum(REJECTION_CODES),
  message: z.string(),
  params: refusalParamsSchema,
  type: z.enum(SCAN_TYPES).nullable(),
  scannedCode: z.string().nullable(),
  trayId: z.string().nullable(),
  trayNumber: z.string().nullable(),
  stationId: z.string().nullable(),
  stationName: z.string().nullable(),
  stationKind: z.string().nullable(),
  operatorId: z.string().nullable(),
  operatorName: z.string().nullable(),
  deviceId: z.string().nullable(),
  occurredAt: z.string().nullable(),
  receivedAt: z.string(),
  resolvedAt: z.string().nullable(),
  resolution: z.string().nullable(),
});
export type ScanExceptionView = z.infer<typeof scanExceptionView>;
