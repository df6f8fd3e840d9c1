import { Outlet } from 'react-router';
import { ADMIN_SECTIONS } from '@/config/nav';
import { TabNav } from '@/components/ui/tab-nav';

/** The admin area: one menu entry, its sections as tabs. */
export function AdminLayout() {
  return (
    <div>
      <TabNav label="Administration" items={ADMIN_SECTIONS} />
      <Outlet />
    </div>
  );
}
