import { z } from 'zod';
import { singleFile } from '../lib/uploads';
import type { Api } from '../http/api';
import { FLOOR_LEADS } from '@shared/domain/access';
import type { Role } from '@shared/domain/vocabulary';
import { exceptionsQuery, MAX_SCAN_BATCH, overrideBody, resolveExceptionBody, scanBatchEnvelopeSchema } from '@shared/schemas/scans';
import { scanExceptionsService } from '../services/scan-exceptions.service';
import { scanIngestService } from '../services/scan-ingest.service';
import { scanOverridesService } from '../services/scan-overrides.service';
import { scanPhotosService } from '../services/scan-photos.service';
import { stationQueueService } from '../services/station-queue.service';
import { badInput, tooLarge } from '../errors';
import type { SignInLimits } from '../middleware/sign-in-limits';

/** People who scan at a station (a supervisor may work a tablet too); the tablet itself may send its outbox. */
export const SCANNING: readonly Role[] = ['operator', 'supervisor', 'admin'];
/** People who decide on refused scans. */
export const DECIDING: readonly Role[] = ['supervisor', 'manager', 'admin'];

const idParams = z.object({ id: z.string().min(1).max(100) });
const PHOTO_MAX_BYTES = 3 * 1024 * 1024;

// Counts the events before the full schema check, so a too-big batch gets 413 rather than 400.
const batchBody = z.object({ events: z.array(z.unknown()) }).transform((b, ctx) => {
  if (b.events.length > MAX_SCAN_BATCH) return b as { events: unknown[] };
  const r = scanBatchEnvelopeSchema.safeParse(b);
  if (!r.success) {
    for (const issue of r.error.issues) ctx.addIssue({ code: 'custom', message: issue.message, path: issue.path });
    return z.NEVER;
  }
  return r.data as { events: unknown[] };
});

export function registerScanRoutes(api: Api, limits: SignInLimits) {
  api.route({
    method: 'post',
    path: '/scans',
    access: { roles: SCANNING, devices: ['tablet'] },
    body: batchBody,
    handler: ({ deps, body, user, device }) => {
      if (body.events.length > MAX_SCAN_BATCH) throw tooLarge(`Send at most ${MAX_SCAN_BATCH} scans at a time.`);
      return scanIngestService.submitQueued(deps, body.events, { user, device });
    },
  });

  api.route({
    method: 'get',
    path: '/scans/clock',
    access: { roles: SCANNING, devices: ['tablet', 'wall'] },
    handler: ({ deps }) => ({ serverTime: new Date(deps.now()).toISOString() }),
  });

  api.route({
    method: 'post',
    path: '/scans/overrides',
    access: { roles: SCANNING, devices: ['tablet'] },
    before: [limits.badge],
    body: overrideBody,
    status: 201,
    handler: ({ deps, body, user, device }) => scanOverridesService.createOverride(deps, body, { device, userId: user?.id ?? null }),
  });

  api.route({
    method: 'get',
    path: '/scans/exceptions',
    access: { roles: FLOOR_LEADS, devices: ['tablet'] },
    query: exceptionsQuery,
    handler: ({ deps, query, user, device }) => {
      // A tablet (or an operator on it) sees only the refusals of its own scans.
      const lead = !!user && FLOOR_LEADS.includes(user.role);
      return scanExceptionsService.exceptions(deps, {
        open: query.open === 'all' ? undefined : query.open === 'true',
        deviceId: lead ? undefined : device!.id,
        sinceHours: query.sinceHours ?? (lead ? undefined : 48),
        limit: query.limit,
      });
    },
  });

  api.route({
    method: 'post',
    path: '/scans/exceptions/:id/resolve',
    access: { roles: DECIDING },
    params: idParams,
    body: resolveExceptionBody,
    handler: ({ deps, params, body, user }) => scanExceptionsService.resolve(deps, params.id, body, user!.id),
  });

  api.route({
    method: 'post',
    path: '/scans/exceptions/:id/retry',
    access: { roles: DECIDING },
    params: idParams,
    handler: ({ deps, params, user }) => scanExceptionsService.retry(deps, params.id, user!.id),
  });

  api.route({
    method: 'get',
    path: '/stations/:id/queue',
    access: { roles: [...SCANNING, ...FLOOR_LEADS], devices: ['tablet'] },
    params: idParams,
    handler: ({ deps, params }) => stationQueueService.stationQueue(deps, params.id),
  });

  api.route({
    method: 'get',
    path: '/scans/lookup',
    access: { roles: [...SCANNING, ...FLOOR_LEADS], devices: ['tablet'] },
    query: z.object({ code: z.string().trim().min(1).max(256) }),
    handler: ({ deps, query }) => stationQueueService.lookup(deps, query.code),
  });

  api.route({
    method: 'post',
    path: '/scans/photos',
    access: { roles: SCANNING, devices: ['tablet'] },
    bodyKind: 'file',
    before: [singleFile(PHOTO_MAX_BYTES)],
    status: 201,
    handler: ({ deps, req, user }) => {
      const file = req.file;
      if (!file) throw badInput('Attach the photo as the field "file".');
      const fields = z
        .object({ code: z.string().trim().min(1).max(256), eventId: z.string().max(100).optional(), operatorId: z.string().max(64).optional() })
        .safeParse(req.body);
      if (!fields.success) throw badInput('Say which tray the photo belongs to (field "code").');
      return scanPhotosService.addPhoto(
        deps,
        { code: fields.data.code, eventId: fields.data.eventId, file, operatorId: fields.data.operatorId },
        user?.id ?? null,
      );
    },
  });

  api.route({
    method: 'get',
    path: '/scans/artwork/:id',
    access: { roles: [...SCANNING, ...FLOOR_LEADS], devices: ['tablet'] },
    params: idParams,
    handler: ({ deps, params, res }) => {
      const { content, mime } = scanPhotosService.artwork(deps, params.id);
      res.set('Cache-Control', 'private, max-age=3600').type(mime).send(content);
    },
  });
}
