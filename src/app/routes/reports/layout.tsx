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

const TABS: {
  to: string;
  label: 'summary' | 'leadTime' | 'cycleTime' | 'flow' | 'onTime' | 'yield';
  icon: typeof Clock;
  roles: readonly Role[];
  end?: boolean;
}[] = [
  { to: '/reports', label: 'summary', icon: LayoutDashboard, roles: REPORT_READERS, end: true },
  { to: 'lead-time', label: 'leadTime', icon: Clock, roles: WITH_SALES },
  { to: 'cycle-time', label: 'cycleTime', icon: GitCommitVertical, roles: REPORT_READERS },
  { to: 'flow', label: 'flow', icon: LineChart, roles: REPORT_READERS },
  { to: 'on-time', label: 'onTime', icon: Truck, roles: WITH_SALES },
  { to: 'yield', label: 'yield', icon: Percent, roles: REPORT_READERS },
];

export function Component() {
  const me = useMe();
  const { t } = useTranslation(['reports', 'costing']);
  const role = me.data?.user.role;
  const tabs = [
    ...TABS.map((x) => ({ ...x, label: t(`layout.tab.${x.label}`) })),
    { to: 'costing', label: t('costing:report.tab'), icon: Scale, roles: COSTING_READERS },
  ];
  return (
    <>
      <PageHeader title={t('layout.title')} subtitle={t('layout.subtitle')} />
      <TabNav label={t('layout.nav')} items={tabs.filter((x) => role && x.roles.includes(role))} />
      <Outlet />
    </>
  );
}
