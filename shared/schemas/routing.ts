// Wire shapes of routings: an order's steps as edited by the planner before release, and
// the per-process templates admins edit.
import { z } from 'zod';
import { PROCESSES, STATION_KINDS } from '@shared/domain/vocabulary';
import { STEP_CONDITIONS, routingProblems, type RoutingTemplate } from '@shared/domain/routing';

const minutes = z.number().min(0, 'Minutes cannot be negative').max(100_000);

export const routingStepInputSchema = z.strictObject({
  name: z.string().trim().min(1, 'Name the step').max(80),
  stationKind: z.enum(STATION_KINDS),
  trayMinutes: minutes,
  pieceMinutes: minutes,
  cureMinutes: z.number().int().min(1).max(10_000).nullable().optional(),
  colour: z.number().int().min(1).max(99).nullable().optional(),
});
export type RoutingStepInput = z.infer<typeof routingStepInputSchema>;

/** PUT /api/orders/:id/routing: the whole routing in its new order (seq is given by position). */
export const routingEditBodySchema = z
  .strictObject({
    steps: z.array(routingStepInputSchema).min(1, 'A routing needs at least one step').max(80),
  })
  .superRefine((body, ctx) => {
    const numbered = body.steps.map((s, i) => ({ ...s, seq: i + 1, cureMinutes: s.cureMinutes ?? null }));
    for (const p of routingProblems(numbered)) {
      ctx.addIssue({ code: 'custom', path: ['steps', (p.seq ?? 1) - 1], message: p.message });
    }
  });
export type RoutingEditBody = z.infer<typeof routingEditBodySchema>;

const times = { trayMinutes: minutes, pieceMinutes: minutes };

export const routingTemplateSchema = z.strictObject({
  process: z.enum(PROCESSES),
  name: z.string().trim().min(1).max(80),
  steps: z
    .array(
      z.discriminatedUnion('type', [
        z.strictObject({
          type: z.literal('step'),
          name: z.string().trim().min(1).max(80),
          stationKind: z.enum(STATION_KINDS),
          ...times,
          cureMinutes: z.number().int().min(1).max(10_000).nullable().optional(),
          when: z.enum(STEP_CONDITIONS).optional(),
        }),
        z.strictObject({
          type: z.literal('colours'),
          fill: z.strictObject(times),
          cure: z.enum(['each', 'once', 'none']),
          cureStep: z.strictObject({ ...times, cureMinutes: z.number().int().min(1).max(10_000) }),
          onceName: z.string().trim().min(1).max(80),
        }),
      ]),
    )
    .min(1)
    .max(60),
}) satisfies z.ZodType<RoutingTemplate>;
