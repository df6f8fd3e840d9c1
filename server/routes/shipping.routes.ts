import { z } from 'zod';
import type { Api } from '../http/api';
import { SHIPPING } from '@shared/domain/access';
import { createShipmentSchema, packCartonsSchema, salesSearchQuerySchema } from '@shared/schemas/shipping';
import { shippingService } from '../services/shipping.service';

const orderParams = z.object({ id: z.string().min(1) });

export function registerShippingRoutes(api: Api) {
  api.route({
    method: 'get',
    path: '/dispatch/orders',
    access: { roles: SHIPPING },
    query: salesSearchQuerySchema,
    handler: ({ deps, query }) => shippingService.dispatchList(deps, query.q),
  });
  api.route({
    method: 'get',
    path: '/orders/:id/packing',
    access: { roles: SHIPPING },
    params: orderParams,
    handler: ({ deps, params }) => shippingService.packing(deps, params.id),
  });
  api.route({
    method: 'post',
    path: '/orders/:id/cartons',
    access: { roles: SHIPPING },
    params: orderParams,
    body: packCartonsSchema,
    status: 201,
    handler: ({ deps, params, body, user }) => shippingService.pack(deps, params.id, body, user!.id),
  });
  api.route({
    method: 'delete',
    path: '/orders/:id/cartons/:cartonId',
    access: { roles: SHIPPING },
    params: z.object({ id: z.string().min(1), cartonId: z.string().min(1) }),
    handler: ({ deps, params, user }) => shippingService.unpack(deps, params.id, params.cartonId, user!.id),
  });
  api.route({
    method: 'get',
    path: '/orders/:id/shipments',
    access: { roles: SHIPPING },
    params: orderParams,
    handler: ({ deps, params }) => shippingService.shipments(deps, params.id),
  });
  api.route({
    method: 'post',
    path: '/orders/:id/shipments',
    access: { roles: SHIPPING },
    params: orderParams,
    body: createShipmentSchema,
    status: 201,
    handler: ({ deps, params, body, user }) => shippingService.createShipment(deps, params.id, body, user!.id),
  });
  api.route({
    method: 'get',
    path: '/orders/:id/shipments/:shipmentId/packing-list.pdf',
    access: { roles: SHIPPING },
    params: z.object({ id: z.string().min(1), shipmentId: z.string().min(1) }),
    handler: async ({ deps, params, res }) => {
      const { pdf, filename } = await shippingService.packingList(deps, params.id, params.shipmentId);
      res.type('application/pdf').set('Content-Disposition', `inline; filename="${filename}"`).send(pdf);
    },
  });
}
