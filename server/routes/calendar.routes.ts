import type { Api } from '../http/api';
import { ADMIN_ONLY, OFFICE } from '@shared/domain/access';
import { calendarBody } from '@shared/schemas/calendar';
import { calendarService } from '../services/calendar.service';

export function registerCalendarRoutes(api: Api) {
  api.route({ method: 'get', path: '/calendar', access: { roles: OFFICE }, handler: ({ deps }) => calendarService.view(deps) });
  api.route({
    method: 'put',
    path: '/calendar',
    access: { roles: ADMIN_ONLY },
    body: calendarBody,
    handler: ({ deps, body, user }) => calendarService.save(deps, body, user!.id),
  });
}
