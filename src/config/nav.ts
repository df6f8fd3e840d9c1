import type { LucideIcon } from 'lucide-react';
import {
  CalendarClock,
  ShieldAlert,
  ScanLine,
  LayoutDashboard,
  MonitorPlay,
  ClipboardList,
  Boxes,
  Flame,
  LineChart,
  Search,
  Users,
  Factory,
  TabletSmartphone,
  Tags,
  DatabaseBackup,
  Settings,
  Route,
  Truck,
  Mail,
  FileText,
  Calculator,
} from 'lucide-react';
import type { Role } from '@shared/domain/vocabulary';
import { QUOTING } from '@shared/domain/access';
import type { CommonStrings } from '@/lib/i18n/common/en';
import { paths } from './paths';

export type NavKey = keyof CommonStrings['nav'];

export interface NavItem {
  to: string;
  /** its name, a key of the `nav` words */
  label: NavKey;
  icon: LucideIcon;
  roles: readonly Role[];
}

export interface NavGroup {
  /** a group's name; a group that shows one entry for a role is shown as that entry */
  label: NavKey;
  icon: LucideIcon;
  items: NavItem[];
}

/** The navigation shows only what the signed-in role may use (the server checks again), grouped so it fits one row. */
export const NAV: NavGroup[] = [
  {
    label: 'groupFloor',
    icon: LayoutDashboard,
    items: [
      { to: paths.station, label: 'station', icon: ScanLine, roles: ['operator', 'supervisor'] },
      { to: paths.floor, label: 'floor', icon: LayoutDashboard, roles: ['supervisor', 'planner', 'manager', 'admin'] },
      { to: paths.scanExceptions, label: 'refusedScans', icon: ShieldAlert, roles: ['supervisor', 'planner', 'manager', 'admin'] },
      { to: paths.loads, label: 'loads', icon: Flame, roles: ['supervisor', 'planner', 'manager'] },
      { to: paths.wall, label: 'wall', icon: MonitorPlay, roles: ['supervisor', 'manager', 'admin'] },
    ],
  },
  {
    label: 'groupOrders',
    icon: ClipboardList,
    items: [
      { to: paths.orders, label: 'orders', icon: ClipboardList, roles: ['planner', 'manager', 'supervisor', 'admin'] },
      { to: paths.quotes, label: 'quotes', icon: FileText, roles: QUOTING },
      { to: paths.moulds, label: 'moulds', icon: Boxes, roles: ['planner', 'manager', 'supervisor', 'admin'] },
      { to: paths.dispatch, label: 'dispatch', icon: Truck, roles: ['planner', 'supervisor', 'sales', 'admin'] },
    ],
  },
  { label: 'reports', icon: LineChart, items: [{ to: paths.reports, label: 'reports', icon: LineChart, roles: ['manager', 'planner', 'admin', 'sales'] }] },
  { label: 'orderStatus', icon: Search, items: [{ to: paths.sales, label: 'orderStatus', icon: Search, roles: ['sales', 'manager', 'planner', 'admin'] }] },
  { label: 'admin', icon: Settings, items: [{ to: paths.admin, label: 'admin', icon: Settings, roles: ['admin'] }] },
];

/** Sections of the admin area, shown as tabs there. */
export const ADMIN_SECTIONS: Omit<NavItem, 'roles'>[] = [
  { to: paths.adminUsers, label: 'adminUsers', icon: Users },
  { to: paths.adminStations, label: 'adminStations', icon: Factory },
  { to: paths.adminDevices, label: 'adminDevices', icon: TabletSmartphone },
  { to: paths.adminReasonCodes, label: 'adminReasons', icon: Tags },
  { to: paths.adminBackups, label: 'adminBackups', icon: DatabaseBackup },
  { to: paths.adminOutbox, label: 'adminOutbox', icon: Mail },
  { to: paths.adminCalendar, label: 'adminCalendar', icon: CalendarClock },
  { to: paths.adminRoutingTemplates, label: 'adminTemplates', icon: Route },
  { to: paths.adminCosting, label: 'adminCosting', icon: Calculator },
  { to: paths.adminSettings, label: 'adminSettings', icon: Settings },
];
