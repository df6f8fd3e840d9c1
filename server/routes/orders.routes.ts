import { z } from 'zod';
import type { Api } from '../http/api';
import { FLOOR_LEADS, GATE_RECORDERS, OFFICE, PLANNING, ADMIN_ONLY } from '@shared/domain/access';
import { PROCESSES } from '@shared/domain/vocabulary';
import {
  importBodySchema,
  orderSpecPatchSchema,
  orderReasonBodySchema,
  orderSpecSchema,
  paymentBodySchema,
  proofApprovalBodySchema,
  releaseBodySchema,
} from '@shared/schemas/orders';
import { routingEditBodySchema, routingTemplateSchema } from '@shared/schemas/routing';
import { travellerPdfQuerySchema } from '@shared/schemas/trays';
import { ordersService } from '../services/orders.service';
import { orderGatesService } from '../services/order-gates.service';
import { orderImportService } from '../services/order-import.service';
import { orderReleaseService } from '../services/order-release.service';
import { orderRoutingService } from '../services/order-routing.service';
import { routingTemplatesService } from '../services/routing-templates.service';
import { traysService } from '../services/trays.service';
import { projectionHistoryService } from '../services/projection-history.service';
import { CSV_MAX_BYTES, PROOF_MAX_BYTES, csvText, singleFile } from '../lib/uploads';
import { badInput } from '../errors';

const idParams = z.object({ id: z.string().min(1).max(64) });
const proofParams = z.object({ id: z.string().min(1).max(64), revision: z.coerce.number().int().min(1).max(10_000) });
const processParams = z.object({ process: z.enum(PROCESSES) });
const importPreviewBody = z.object({ csv: z.string().max(CSV_MAX_BYTES).optional() });

export function registerOrderRoutes(api: Api) {
  api.route({ method: 'get', path: '/customers', access: { roles: OFFICE }, handler: ({ deps }) => ordersService.customers(deps) });

  api.route({ method: 'get', path: '/orders', access: { roles: OFFICE }, handler: ({ deps }) => ordersService.list(deps) });
  api.route({
    method: 'post',
    path: '/orders',
    access: { roles: PLANNING },
    body: orderSpecSchema,
    status: 201,
    handler: ({ deps, body, user }) => ordersService.create(deps, body, user!.id),
  });

  // CSV import: a preview that changes nothing, then the import of the valid rows
  api.route({
    method: 'post',
    path: '/orders/import/preview',
    access: { roles: PLANNING },
    bodyKind: 'json-or-file',
    before: [singleFile(CSV_MAX_BYTES)],
    body: importPreviewBody,
    handler: ({ req, body, deps }) => {
      const text = req.file ? csvText(req.file.buffer) : body.csv;
      if (text === undefined) throw badInput('Upload a CSV file (field "file") or paste its text (field "csv").', undefined, 'file_missing');
      if (text.trim() === '') throw badInput('The file is empty.', undefined, 'empty_file');
      return orderImportService.previewImport(deps, text);
    },
  });
  api.route({
    method: 'post',
    path: '/orders/import',
    access: { roles: PLANNING },
    body: importBodySchema,
    status: 201,
    handler: ({ deps, body, user }) => orderImportService.importOrders(deps, body.csv, user!.id),
  });

  api.route({
    method: 'get',
    path: '/orders/:id',
    access: { roles: OFFICE },
    params: idParams,
    handler: ({ deps, params }) => ordersService.get(deps, params.id),
  });
  api.route({
    method: 'patch',
    path: '/orders/:id',
    access: { roles: PLANNING },
    params: idParams,
    body: orderSpecPatchSchema,
    handler: ({ deps, params, body, user }) => ordersService.update(deps, params.id, body, user!.id),
  });

  api.route({
    method: 'post',
    path: '/orders/:id/hold',
    access: { roles: PLANNING },
    params: idParams,
    body: orderReasonBodySchema,
    handler: ({ deps, params, body, user }) => ordersService.hold(deps, params.id, body.reason, user!.id),
  });
  api.route({
    method: 'post',
    path: '/orders/:id/resume',
    access: { roles: PLANNING },
    params: idParams,
    handler: ({ deps, params, user }) => ordersService.resume(deps, params.id, user!.id),
  });
  api.route({
    method: 'post',
    path: '/orders/:id/cancel',
    access: { roles: PLANNING },
    params: idParams,
    body: orderReasonBodySchema,
    handler: ({ deps, params, body, user }) => ordersService.cancel(deps, params.id, body.reason, user!.id),
  });

  api.route({
    method: 'post',
    path: '/orders/:id/payment',
    access: { roles: GATE_RECORDERS },
    params: idParams,
    body: paymentBodySchema,
    status: 201,
    handler: ({ deps, params, body, user }) => orderGatesService.recordPayment(deps, params.id, body, user!),
  });

  api.route({
    method: 'post',
    path: '/orders/:id/proofs',
    access: { roles: PLANNING },
    params: idParams,
    bodyKind: 'file',
    before: [singleFile(PROOF_MAX_BYTES)],
    status: 201,
    handler: ({ deps, params, req, user }) => orderGatesService.uploadProof(deps, params.id, req.file, user!.id),
  });
  api.route({
    method: 'get',
    path: '/orders/:id/proofs/:revision/file',
    access: { roles: OFFICE },
    params: proofParams,
    handler: ({ deps, params, res }) => {
      const f = orderGatesService.proofFile(deps, params.id, params.revision);
      res
        .type(f.mime)
        .set('Content-Disposition', `inline; filename="${f.downloadName}"`)
        .set('X-Content-Type-Options', 'nosniff')
        .set('Cache-Control', 'private, max-age=3600')
        .send(f.content);
    },
  });
  api.route({
    method: 'post',
    path: '/orders/:id/proofs/:revision/approve',
    access: { roles: GATE_RECORDERS },
    params: proofParams,
    body: proofApprovalBodySchema,
    handler: ({ deps, params, body, user }) => orderGatesService.approveProof(deps, params.id, params.revision, body, user!.id),
  });

  api.route({
    method: 'put',
    path: '/orders/:id/routing',
    access: { roles: PLANNING },
    params: idParams,
    body: routingEditBodySchema,
    handler: ({ deps, params, body, user }) => orderRoutingService.editRouting(deps, params.id, body, user!.id),
  });
  api.route({
    method: 'post',
    path: '/orders/:id/routing/reset',
    access: { roles: PLANNING },
    params: idParams,
    handler: ({ deps, params, user }) => orderRoutingService.resetRouting(deps, params.id, user!.id),
  });

  api.route({
    method: 'post',
    path: '/orders/:id/release',
    access: { roles: PLANNING },
    params: idParams,
    body: releaseBodySchema,
    status: 201,
    handler: ({ deps, params, body, user }) =>
      projectionHistoryService.afterRelease(deps, params.id, orderReleaseService.release(deps, params.id, body, user!.id)),
  });

  api.route({
    method: 'get',
    path: '/orders/:id/travellers.pdf',
    access: { roles: FLOOR_LEADS },
    params: idParams,
    query: travellerPdfQuerySchema,
    handler: async ({ deps, params, query, res }) => {
      const ids = query.ids ? query.ids.split(',').filter(Boolean) : undefined;
      const { pdf, name } = await traysService.orderPdf(deps, params.id, { layout: query.layout, ids, kind: query.kind });
      res.type('application/pdf').set('Content-Disposition', `attachment; filename="${name}"`).send(pdf);
    },
  });

  api.route({ method: 'get', path: '/routing-templates', access: { roles: PLANNING }, handler: ({ deps }) => routingTemplatesService.listTemplates(deps) });
  api.route({
    method: 'put',
    path: '/routing-templates/:process',
    access: { roles: ADMIN_ONLY },
    params: processParams,
    body: routingTemplateSchema,
    handler: ({ deps, params, body, user }) => routingTemplatesService.saveTemplate(deps, params.process, body, user!.id),
  });
}
