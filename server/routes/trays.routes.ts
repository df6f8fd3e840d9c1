import { z } from 'zod';
import type { Api } from '../http/api';
import { FLOOR_LEADS, OFFICE } from '@shared/domain/access';
import { mergeBodySchema, mouldPatchSchema, splitBodySchema } from '@shared/schemas/trays';
import { TRAVELLER_LAYOUT_VALUES } from '@shared/schemas/travellers';
import { traysService } from '../services/trays.service';

const idParams = z.object({ id: z.string().min(1).max(80) });
const layoutQuery = z.object({ layout: z.enum(TRAVELLER_LAYOUT_VALUES).default('a6') });

export function registerTrayRoutes(api: Api) {
  api.route({
    method: 'get',
    path: '/trays/:id',
    access: { roles: OFFICE },
    params: idParams,
    handler: ({ deps, params }) => traysService.get(deps, params.id),
  });
  api.route({
    method: 'post',
    path: '/trays/:id/reprint',
    access: { roles: FLOOR_LEADS },
    params: idParams,
    handler: ({ deps, params, user }) => traysService.reprint(deps, params.id, user!.id),
  });
  api.route({
    method: 'get',
    path: '/trays/:id/traveller.pdf',
    access: { roles: FLOOR_LEADS },
    params: idParams,
    query: layoutQuery,
    handler: async ({ deps, params, query, res }) => {
      const { pdf, name } = await traysService.trayPdf(deps, params.id, query.layout);
      res.type('application/pdf').set('Content-Disposition', `attachment; filename="${name}"`).send(pdf);
    },
  });
  api.route({
    method: 'post',
    path: '/trays/:id/split',
    access: { roles: FLOOR_LEADS },
    params: idParams,
    body: splitBodySchema,
    status: 201,
    handler: ({ deps, params, body, user }) => traysService.split(deps, params.id, body, user!.id),
  });
  api.route({
    method: 'post',
    path: '/trays/merge',
    access: { roles: FLOOR_LEADS },
    body: mergeBodySchema,
    handler: ({ deps, body, user }) => traysService.merge(deps, body, user!.id),
  });

  api.route({ method: 'get', path: '/moulds', access: { roles: OFFICE }, handler: ({ deps }) => traysService.mouldLibrary(deps) });
  api.route({
    method: 'patch',
    path: '/moulds/:id',
    access: { roles: FLOOR_LEADS },
    params: idParams,
    body: mouldPatchSchema,
    handler: ({ deps, params, body, user }) => traysService.updateMould(deps, params.id, body, user!.id),
  });
}
