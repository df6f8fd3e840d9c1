import type { Role } from '@shared/domain/vocabulary';

// Every client path in one place.
export const paths = {
  signIn: '/sign-in',
  changePassword: '/change-password',
  home: '/',
  station: '/station',
  pair: '/pair',
  floor: '/floor',
  scanExceptions: '/exceptions',
  wall: '/wall',
  orders: '/orders',
  quotes: '/quotes',
  newOrder: '/orders/new',
  importOrders: '/orders/import',
  order: (id: string) => `/orders/${id}`,
  tray: (id: string) => `/trays/${id}`,
  moulds: '/moulds',
  loads: '/loads',
  reports: '/reports',
  sales: '/sales',
  salesOrder: (id: string) => `/sales/orders/${id}`,
  salesWhatIf: '/sales/when',
  dispatch: '/dispatch',
  dispatchOrder: (id: string) => `/dispatch/${id}`,
  admin: '/admin',
  adminUsers: '/admin/users',
  adminStations: '/admin/stations',
  adminDevices: '/admin/devices',
  adminRoutingTemplates: '/admin/routing-templates',
  adminReasonCodes: '/admin/reason-codes',
  adminBackups: '/admin/backups',
  adminOutbox: '/admin/outbox',
  adminCalendar: '/admin/calendar',
  adminCosting: '/admin/costing',
  adminSettings: '/admin/settings',
  publicStatus: (token: string) => `/status/${token}`,
} as const;

/** Where each role lands after signing in: the first thing that person needs. */
export const roleHome: Record<Role, string> = {
  operator: paths.station,
  supervisor: paths.floor,
  planner: paths.orders,
  manager: paths.reports,
  sales: paths.sales,
  admin: paths.adminUsers,
};
