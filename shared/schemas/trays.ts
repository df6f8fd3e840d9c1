// Wire shapes of trays and moulds: the tray page, split, merge, reprint and the mould library.
import { z } from 'zod';
import type { RoutingStep, TrayPhase, TravellerKind } from '@shared/domain/vocabulary';
import { TRAVELLER_LAYOUT_VALUES } from './travellers';

/** POST /api/trays/:id/split: pieces taken off into new trays; a part may go back to an earlier step for rework. */
export const splitBodySchema = z.strictObject({
  parts: z
    .array(
      z.strictObject({
        quantity: z.number().int().min(1),
        /** rework: the step the new tray waits for (at or before the tray's current step) */
        stepSeq: z.number().int().min(1).optional(),
      }),
    )
    .min(1)
    .max(20),
  note: z.string().trim().max(300).optional(),
});
export type SplitBody = z.infer<typeof splitBodySchema>;

/** POST /api/trays/merge: the first tray receives the pieces of the others. */
export const mergeBodySchema = z.strictObject({
  trayIds: z.array(z.string().min(1)).min(2).max(50),
  note: z.string().trim().max(300).optional(),
});
export type MergeBody = z.infer<typeof mergeBodySchema>;

export const travellerPdfQuerySchema = z.object({
  layout: z.enum(TRAVELLER_LAYOUT_VALUES).default('a6'),
  /** comma-separated traveller ids; all of the order's when absent */
  ids: z.string().max(20_000).optional(),
  kind: z.enum(['all', 'tray', 'mould']).default('all'),
});

export const mouldPatchSchema = z
  .strictObject({
    storageLocation: z.string().trim().max(80).nullable().optional(),
    retired: z.boolean().optional(),
  })
  .refine((b) => b.storageLocation !== undefined || b.retired !== undefined, 'Nothing to change');
export type MouldPatch = z.infer<typeof mouldPatchSchema>;

export interface TrayEventView {
  id: string;
  type: string;
  stepSeq: number | null;
  stepName: string | null;
  stationKind: string | null;
  stationName: string | null;
  by: string | null;
  occurredAt: string;
  qtyIn: number | null;
  goodQty: number | null;
  scrapQty: number | null;
  reworkQty: number | null;
  scrapReason: string | null;
  note: string | null;
}

export interface TrayLink {
  id: string;
  number: string;
  quantity: number;
}

export interface TrayView {
  id: string;
  number: string;
  code: string;
  revision: number;
  kind: TravellerKind;
  orderId: string;
  order: { id: string; number: string; title: string; customer: string; dueDate: string };
  quantity: number;
  releasedQuantity: number;
  status: TrayPhase | 'on_hold';
  phase: TrayPhase;
  onHold: boolean;
  holdReason: string | null;
  cureReadyAt: string | null;
  releasedAt: string;
  nextStep: { seq: number; stationKind: string; name: string } | null;
  routing: RoutingStep[];
  events: TrayEventView[];
  parent: TrayLink | null;
  children: TrayLink[];
  mergedInto: TrayLink | null;
  mergedFrom: TrayLink[];
  mould: { id: string; number: string; side: 'front' | 'back' } | null;
}

export interface MouldLibraryItem {
  id: string;
  number: string;
  side: 'front' | 'back';
  designKey: string;
  status: 'engraving' | 'checking' | 'ready' | 'retired';
  storageLocation: string | null;
  useCount: number;
  readyAt: string | null;
  firstOrder: { id: string; number: string; title: string; customer: string } | null;
  lastUsedAt: string | null;
}
