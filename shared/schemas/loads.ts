import { z } from 'zod';
import { LOAD_KINDS, type LoadKind } from '@shared/domain/traveller/station-kinds';

export const createLoadBody = z.strictObject({
  kind: z.enum(LOAD_KINDS),
  trayIds: z.array(z.string().min(1)).min(1).max(200),
});
export type CreateLoadBody = z.infer<typeof createLoadBody>;

export interface LoadTrayView {
  trayId: string;
  number: string;
  orderId: string;
  orderNumber: string;
  customer: string;
  quantity: number;
  waitingMinutes: number | null;
  onHold: boolean;
  stepName: string | null;
}

export interface LoadGroup {
  /** cure minutes of an oven group, or the finish of a plating group */
  key: string;
  label: string;
  trays: LoadTrayView[];
  pieces: number;
  oldestMinutes: number | null;
}

export interface LoadView {
  id: string;
  number: string;
  kind: LoadKind;
  groupKey: string;
  status: 'open' | 'split';
  createdAt: string;
  splitAt: string | null;
  trays: LoadTrayView[];
  /** pieces per order: what each order put in, and gets back when the load is split */
  orders: { orderId: string; orderNumber: string; pieces: number }[];
  pieces: number;
}

export interface LoadsOverview {
  oven: LoadGroup[];
  plating: LoadGroup[];
  open: LoadView[];
}
