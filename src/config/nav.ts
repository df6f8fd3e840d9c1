import type { LucideIcon } from 'lucide-react';
import { CalendarClock, ShieldAlert, ScanLine, LayoutDashboard, MonitorPlay, ClipboardList, Boxes, Flame, LineChart, Search, Users, Factory, TabletSmartphone, Tags, DatabaseBackup, Settings, Route, Truck, Mail } from 'lucide-react';
import type { Role } from '@shared/domain/vocabulary';
import { paths } from './paths';

export interface NavItem {
  to: string;
  label: string;
  icon: LucideIcon;
  roles: readonly Role[];
}

/** The navigation shows only what the signed-in role may use (the server checks again). */
export const NAV: NavItem[] = [
  { to: paths.station, label: 'Station', icon: ScanLine, roles: ['operator', 'supervisor'] },
  { to: paths.floor, label: 'Floor', icon: LayoutDashboard, roles: ['supervisor', 'planner', 'manager', 'admin'] },
  { to: paths.scanExceptions, label: 'Refused scans', icon: ShieldAlert, roles: ['supervisor', 'planner', 'manager', 'admin'] },
  { to: paths.orders, label: 'Orders', icon: ClipboardList, roles: ['planner', 'manager', 'supervisor', 'admin'] },
  { to: paths.moulds, label: 'Moulds', icon: Boxes, roles: ['planner', 'manager', 'supervisor', 'admin'] },
  { to: paths.loads, label: 'Oven & bath loads', icon: Flame, roles: ['supervisor', 'planner', 'manager'] },
  { to: paths.reports, label: 'Reports', icon: LineChart, roles: ['manager', 'planner', 'admin', 'sales'] },
  { to: paths.sales, label: 'Order status', icon: Search, roles: ['sales', 'manager', 'planner', 'admin'] },
  { to: paths.dispatch, label: 'Packing & dispatch', icon: Truck, roles: ['planner', 'supervisor', 'sales', 'admin'] },
  { to: paths.wall, label: 'Wall', icon: MonitorPlay, roles: ['supervisor', 'manager', 'admin'] },
  { to: paths.admin, label: 'Admin', icon: Settings, roles: ['admin'] },
];

/** Sections of the admin area, shown as tabs there. */
export const ADMIN_SECTIONS: Omit<NavItem, 'roles'>[] = [
  { to: paths.adminUsers, label: 'People', icon: Users },
  { to: paths.adminStations, label: 'Stations', icon: Factory },
  { to: paths.adminDevices, label: 'Tablets & walls', icon: TabletSmartphone },
  { to: paths.adminReasonCodes, label: 'Reasons', icon: Tags },
  { to: paths.adminBackups, label: 'Backups', icon: DatabaseBackup },
  { to: paths.adminOutbox, label: 'Outbox', icon: Mail },
  { to: paths.adminCalendar, label: 'Working calendar', icon: CalendarClock },
  { to: paths.adminRoutingTemplates, label: 'Routing templates', icon: Route },
];
