import { Outlet } from 'react-router';
import { TabNav } from '@/components/ui/tab-nav';
import { useTranslation } from 'react-i18next';
import { Clock, GitCommitVertical, LayoutDashboard, LineChart, Percent, Scale, Truck } from 'lucide-react';
import type { Role } from '@shared/domain/vocabulary';
import { COSTING_READERS, REPORT_READERS } from '@shared/domain/access';
import { useMe } from '@/features/auth/api/get-me';
import { PageHeader } from '@/components/ui/panels';

export const WITH_SALES: readonly Role[] = [...REPORT_READERS, 'sales'];
export const handle = { roles: WITH_SALES };

const TABS = [
  { to: '/reports', label: 'Summary', icon: LayoutDashboard, roles: REPORT_READERS, end: true },
  { to: 'lead-time', label: 'Lead time', icon: Clock, roles: WITH_SALES },
  { to: 'cycle-time', label: 'Cycle time', icon: GitCommitVertical, roles: REPORT_READERS },
  { to: 'flow', label: 'Flow & throughput', icon: LineChart, roles: REPORT_READERS },
  { to: 'on-time', label: 'On-time delivery', icon: Truck, roles: WITH_SALES },
  { to: 'yield', label: 'Yield & scrap', icon: Percent, roles: REPORT_READERS },
];

export function Component() {
  const me = useMe();
  const { t } = useTranslation('costing');
  const role = me.data?.user.role;
  const tabs = [...TABS, { to: 'costing', label: t('report.tab'), icon: Scale, roles: COSTING_READERS }];
  return (
    <>
      <PageHeader title="Reports" subtitle="How long orders take, where trays wait, what comes out good. Every figure is computed on the server from the scans." />
      <TabNav label="Reports" items={tabs.filter((t) => role && t.roles.includes(role))} />
      <Outlet />
    </>
  );
}
