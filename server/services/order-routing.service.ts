// The planner's edits of an order's routing before release, and making it again from the template.
import type { AppDeps } from '../app-deps';
import { ordersRepository } from '../repositories/orders.repository';
import type { RoutingEditBody } from '@shared/schemas/routing';
import type { RoutingStep } from '@shared/domain/vocabulary';
import { cures } from '@shared/domain/traveller';
import { routingFromSpec, specOf, stepRows } from './order-spec.service';
import { auditOrder, getOrder, ordersService, refuseIfReleased } from './orders.service';

export const orderRoutingService = {
  editRouting(deps: AppDeps, id: string, body: RoutingEditBody, actorId: string) {
    const { db } = deps;
    const now = deps.now();
    db.transaction((tx) => {
      const order = getOrder(tx, id);
      refuseIfReleased(order, 'its routing');
      const steps: RoutingStep[] = body.steps.map((s, i) => ({
        ...s,
        seq: i + 1,
        cureMinutes: cures(s.stationKind) ? (s.cureMinutes ?? null) : null,
        colour: s.colour ?? null,
      }));
      ordersRepository.replaceSteps(tx, id, 'tray', stepRows(id, 'tray', steps));
      ordersRepository.update(tx, id, { updatedAt: now });
      auditOrder(tx, now, actorId, 'order.routing_edit', id, `Routing edited: ${steps.length} steps`, { params: { steps: steps.length } });
    });
    return ordersService.get(deps, id);
  },

  resetRouting(deps: AppDeps, id: string, actorId: string) {
    const { db } = deps;
    const now = deps.now();
    db.transaction((tx) => {
      const order = getOrder(tx, id);
      refuseIfReleased(order, 'its routing');
      const spec = specOf(order);
      ordersRepository.replaceSteps(tx, id, 'tray', stepRows(id, 'tray', routingFromSpec(tx, spec)));
      auditOrder(tx, now, actorId, 'order.routing_reset', id, 'Routing made again from the template', { params: {} });
    });
    return ordersService.get(deps, id);
  },
};
