import { z } from 'zod';
import type { Api } from '../http/api';
import { ADMIN_ONLY } from '@shared/domain/access';
import { factoryLanguageBody, reasonCodeBody, updateReasonCodeBody } from '@shared/schemas/admin';
import { adminService } from '../services/admin.service';
import { factorySettingsService } from '../services/factory-settings.service';

export function registerAdminRoutes(api: Api) {
  api.route({ method: 'get', path: '/admin/reason-codes', access: { roles: ADMIN_ONLY }, handler: ({ deps }) => adminService.reasonCodes(deps) });
  api.route({
    method: 'post',
    path: '/admin/reason-codes',
    access: { roles: ADMIN_ONLY },
    body: reasonCodeBody,
    status: 201,
    handler: ({ deps, body, user }) => adminService.createReasonCode(deps, body, user!.id),
  });
  api.route({
    method: 'patch',
    path: '/admin/reason-codes/:code',
    access: { roles: ADMIN_ONLY },
    params: z.object({ code: z.string().min(1).max(40) }),
    body: updateReasonCodeBody,
    handler: ({ deps, params, body, user }) => adminService.updateReasonCode(deps, params.code, body, user!.id),
  });
  api.route({ method: 'get', path: '/admin/factory-language', access: { roles: ADMIN_ONLY }, handler: ({ deps }) => factorySettingsService.view(deps) });
  api.route({
    method: 'put',
    path: '/admin/factory-language',
    access: { roles: ADMIN_ONLY },
    body: factoryLanguageBody,
    handler: ({ deps, body, user }) => factorySettingsService.setLanguage(deps, body, user!.id),
  });
  api.route({ method: 'get', path: '/admin/backups', access: { roles: ADMIN_ONLY }, handler: ({ deps }) => adminService.listBackups(deps) });
  api.route({
    method: 'post',
    path: '/admin/backups',
    access: { roles: ADMIN_ONLY },
    status: 201,
    handler: ({ deps, user }) => adminService.makeBackup(deps, user!.id),
  });
}
