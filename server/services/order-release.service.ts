// Release to the floor: the gates are checked, the trays made from the released quantity, the
// moulds planned (a stored mould of the same design is checked, not engraved again) and every
// traveller gets its first state.
import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import { ordersRepository } from '../repositories/orders.repository';
import { traysRepository } from '../repositories/trays.repository';
import { rowFromState, trayStatesRepository } from '../repositories/tray-states.repository';
import { mouldsRepository } from '../repositories/moulds.repository';
import { AppError, badInput, conflict } from '../errors';
import { checkReleasedAt, type OrderGate, type ReleaseBody, type ReleaseResult } from '@shared/schemas/orders';
import { mouldRouting, requiredMoulds } from '@shared/domain/routing';
import { MAX_TRAYS_PER_RELEASE, mouldNumber, releasedQuantity, splitIntoTrays, trayNumber } from '@shared/domain/trays';
import { initialTrayState, type RoutingStep, type TravellerKind } from '@shared/domain/vocabulary';
import { kindTraits } from '@shared/domain/traveller';
import { openGates, PRE_RELEASE_STATUSES } from './order-gates';
import { routingFromSpec, routingOf, specOf, stepRows } from './order-spec.service';
import { auditOrder, getOrder, isReleased, travellerCode } from './orders.service';

const GATE_MESSAGES: Record<OrderGate, string> = {
  payment_missing: 'No payment is recorded (nor a manager’s exception). Record the payment first.',
  proof_not_approved: 'The latest artwork proof is not approved by the customer yet. Record the approval first.',
};

/** The first state of a traveller just released: waiting for `stepSeq` of its routing. */
function releasedState(input: {
  trayId: string;
  kind: TravellerKind;
  quantity: number;
  releasedAt: number;
  stepSeq: number;
  routing: readonly RoutingStep[];
  now: number;
}) {
  const first = initialTrayState({ trayId: input.trayId, kind: input.kind, quantity: input.quantity, releasedAt: new Date(input.releasedAt).toISOString() });
  return rowFromState({ ...first, stepSeq: input.stepSeq }, input.routing, input.now);
}

export const orderReleaseService = {
  release(deps: AppDeps, id: string, body: ReleaseBody, actorId: string): ReleaseResult {
    const { db } = deps;
    const now = deps.now();
    let releasedAt = now;
    if (body.releasedAt) {
      const problem = checkReleasedAt(body.releasedAt, new Date(now));
      if (problem) throw badInput(problem, [{ path: ['releasedAt'], message: problem }], 'bad_released_at');
      releasedAt = Math.min(Date.parse(body.releasedAt), now);
    }
    const created = db.transaction((tx) => {
      const order = getOrder(tx, id);
      if (isReleased(order)) throw conflict('already_released', `Order ${order.number} was released already.`);
      if (order.status === 'cancelled') throw conflict('order_cancelled', `Order ${order.number} is cancelled.`);
      if (order.status === 'on_hold') throw conflict('order_on_hold', `Order ${order.number} is on hold: ${order.holdReason ?? 'no reason given'}.`);
      const gates = openGates(tx, id);
      if (gates.length) {
        throw new AppError(409, gates[0], gates.map((g) => GATE_MESSAGES[g]).join(' '), { missing: gates });
      }
      const spec = specOf(order);
      let routing = routingOf(tx, id, 'tray');
      if (routing.length === 0) {
        routing = routingFromSpec(tx, spec);
        ordersRepository.replaceSteps(tx, id, 'tray', stepRows(id, 'tray', routing));
      }
      const total = releasedQuantity(order.quantity, order.overrunPct);
      const parts = splitIntoTrays(total, body.traySize);
      if (parts.length > MAX_TRAYS_PER_RELEASE) {
        throw badInput(
          `${parts.length} trays is more than ${MAX_TRAYS_PER_RELEASE}; choose a larger tray size.`,
          [{ path: ['traySize'], message: 'Too many trays' }],
          'too_many_trays',
        );
      }

      // moulds: reuse the stored ones of this design, make the others
      const plan = requiredMoulds(spec).map((side) => ({ side, stored: mouldsRepository.reusable(tx, order.designKey, side) }));
      const anyNew = plan.some((p) => !p.stored);
      const mouldSteps = mouldRouting({ reuse: !anyNew, process: spec.process });
      ordersRepository.replaceSteps(tx, id, 'mould', stepRows(id, 'mould', mouldSteps));
      const checkSeq = mouldSteps.find((s) => kindTraits(s.stationKind).mouldShop === 'check')!.seq;
      const mouldTravellers: ReleaseResult['moulds'] = [];
      for (const { side, stored } of plan) {
        let mouldId: string;
        if (stored) {
          mouldId = stored.id;
          mouldsRepository.update(tx, mouldId, { useCount: stored.useCount + 1, status: 'checking', updatedAt: now });
        } else {
          mouldId = crypto.randomUUID();
          mouldsRepository.insert(tx, {
            id: mouldId,
            number: mouldNumber(order.number, side),
            designKey: order.designKey,
            side,
            firstOrderId: id,
            status: 'engraving',
            useCount: 1,
            createdAt: now,
            updatedAt: now,
          });
        }
        mouldsRepository.link(tx, id, mouldId);
        const trayId = crypto.randomUUID();
        const number = mouldNumber(order.number, side);
        traysRepository.insert(tx, { id: trayId, number, kind: 'mould', orderId: id, mouldId, revision: 1, quantity: 1, releasedAt, createdAt: now });
        // a stored mould skips engraving: its traveller starts at the check
        const firstSeq = stored ? checkSeq : 1;
        trayStatesRepository.insert(tx, releasedState({ trayId, kind: 'mould', quantity: 1, releasedAt, stepSeq: firstSeq, routing: mouldSteps, now }));
        mouldTravellers.push({ id: trayId, number, code: travellerCode(deps, { number, revision: 1 }), quantity: 1 });
      }

      const trayTravellers: ReleaseResult['trays'] = parts.map((quantity, i) => {
        const trayId = crypto.randomUUID();
        const number = trayNumber(order.number, i + 1);
        traysRepository.insert(tx, { id: trayId, number, kind: 'tray', orderId: id, revision: 1, quantity, releasedAt, createdAt: now });
        trayStatesRepository.insert(tx, releasedState({ trayId, kind: 'tray', quantity, releasedAt, stepSeq: routing[0].seq, routing, now }));
        return { id: trayId, number, code: travellerCode(deps, { number, revision: 1 }), quantity };
      });

      const moved = ordersRepository.updateIfStatus(tx, id, PRE_RELEASE_STATUSES, { status: 'released', traySize: body.traySize, releasedAt, updatedAt: now });
      if (!moved) throw conflict('already_released', `Order ${order.number} was released already.`);
      const reused = plan.filter((p) => p.stored).length;
      auditOrder(
        tx,
        now,
        actorId,
        'order.release',
        id,
        `Released ${total} pieces in ${parts.length} trays of up to ${body.traySize}` +
          `${body.releasedAt ? ` (on the floor since ${new Date(releasedAt).toISOString().slice(0, 16).replace('T', ' ')} UTC)` : ''}` +
          `; ${plan.length} mould traveller${plan.length === 1 ? '' : 's'}${reused ? ` (${reused} reusing a stored mould)` : ''}`,
        {
          params: {
            pieces: total,
            trays: parts.length,
            size: body.traySize,
            since: body.releasedAt ? new Date(releasedAt).toISOString() : null,
            moulds: plan.length,
            reused,
          },
        },
      );
      return { trays: trayTravellers, moulds: mouldTravellers };
    });
    return created;
  },
};
