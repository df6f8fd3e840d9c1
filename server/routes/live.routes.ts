import { checkAccess, type Api } from '../http/api';
import { readAuth } from '../middleware/authenticate';
import { ALL_ROLES, OFFICE } from '@shared/domain/access';
import { wipService } from '../services/wip.service';
import { wallService } from '../services/wall.service';
import { streamService } from '../services/stream.service';

export function registerLiveRoutes(api: Api) {
  api.route({
    method: 'get',
    path: '/wip',
    access: { roles: ALL_ROLES, devices: ['wall', 'tablet'] },
    handler: ({ deps }) => wipService.wip(deps),
  });
  api.route({
    method: 'get',
    path: '/wall',
    access: { roles: OFFICE, devices: ['wall'] },
    handler: ({ deps }) => wallService.view(deps),
  });
  api.route({
    method: 'get',
    path: '/stream',
    access: { roles: ALL_ROLES, devices: ['wall', 'tablet'] },
    handler: ({ deps, req, res }) => {
      // checked again while the stream is open: it closes when the session ends or the person or device is switched off
      const access = { roles: ALL_ROLES, devices: ['wall', 'tablet'] as const };
      streamService.open(deps, res, async () => {
        try {
          checkAccess(access, await readAuth(deps, req));
          return true;
        } catch {
          return false;
        }
      });
    },
  });
}
