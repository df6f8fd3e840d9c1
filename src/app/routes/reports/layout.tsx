import { NavLink, Outlet } from 'react-router';
import { Clock, GitCommitVertical, LineChart, Percent, Truck } from 'lucide-react';
import type { Role } from '@shared/domain/vocabulary';
import { REPORT_READERS } from '@shared/domain/access';
import { useMe } from '@/features/auth/api/get-me';
import { PageHeader } from '@/components/ui/panels';

export const WITH_SALES: readonly Role[] = [...REPORT_READERS, 'sales'];
export const handle = { roles: WITH_SALES };

const TABS = [
  { to: 'lead-time', label: 'Lead time', icon: Clock, roles: WITH_SALES },
  { to: 'cycle-time', label: 'Cycle time', icon: GitCommitVertical, roles: REPORT_READERS },
  { to: 'flow', label: 'Flow & throughput', icon: LineChart, roles: REPORT_READERS },
  { to: 'on-time', label: 'On-time delivery', icon: Truck, roles: WITH_SALES },
  { to: 'yield', label: 'Yield & scrap', icon: Percent, roles: REPORT_READERS },
];

export function Component() {
  const me = useMe();
  const role = me.data?.user.role;
  return (
    <>
      <PageHeader title="Reports" subtitle="How long orders take, where trays wait, what comes out good. Every figure is computed on the server from the scans." />
      <nav aria-label="Reports" className="mb-6 flex flex-wrap gap-1 border-b-2 border-harbour-100">
        {TABS.filter((t) => role && t.roles.includes(role)).map((t) => (
          <NavLink
            key={t.to}
            to={t.to}
            className={({ isActive }) =>
              `-mb-0.5 flex min-h-11 items-center gap-2 border-b-4 px-3 font-bold ${isActive ? 'border-brass-400 text-harbour-900' : 'border-transparent text-harbour-700 hover:text-harbour-900'}`
            }
          >
            <t.icon className="h-5 w-5" aria-hidden />
            {t.label}
          </NavLink>
        ))}
      </nav>
      <Outlet />
    </>
  );
}
