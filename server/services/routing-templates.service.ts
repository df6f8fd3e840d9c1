// The routing templates admins keep, one per process (the built-in default where none is stored).
import type { AppDeps } from '../app-deps';
import { ordersRepository } from '../repositories/orders.repository';
import { auditRepository } from '../repositories/audit.repository';
import { badInput } from '../errors';
import { routingTemplateSchema } from '@shared/schemas/routing';
import { DEFAULT_ROUTING_TEMPLATES, type RoutingTemplate } from '@shared/domain/routing';
import type { Process } from '@shared/domain/vocabulary';
import { iso } from '@shared/domain/time-zone';

export const routingTemplatesService = {
  listTemplates(deps: AppDeps) {
    return ordersRepository.templates(deps.db).map((row) => {
      const parsed = routingTemplateSchema.safeParse(row.template);
      return {
        process: row.process as Process,
        template: parsed.success ? parsed.data : DEFAULT_ROUTING_TEMPLATES[row.process as Process],
        updatedAt: iso(row.updatedAt),
      };
    });
  },

  saveTemplate(deps: AppDeps, process: Process, template: RoutingTemplate, actorId: string) {
    if (template.process !== process) throw badInput('The template is for another process.', [{ path: ['process'], message: 'Does not match the path' }]);
    const now = deps.now();
    deps.db.transaction((tx) => {
      ordersRepository.saveTemplate(tx, { process, name: template.name, template, updatedAt: now, updatedBy: actorId });
      auditRepository.record(tx, now, {
        userId: actorId,
        action: 'routing_template.update',
        entity: 'routing_template',
        entityId: process,
        detail: { steps: template.steps.length },
      });
    });
    return routingTemplatesService.listTemplates(deps).find((t) => t.process === process)!;
  },
};
