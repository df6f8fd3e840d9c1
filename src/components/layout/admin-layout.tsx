import { Outlet } from 'react-router';
import { useTranslation } from 'react-i18next';
import { ADMIN_SECTIONS } from '@/config/nav';
import { TabNav } from '@/components/ui/tab-nav';

/** The admin area: one menu entry, its sections as tabs. */
export function AdminLayout() {
  const { t } = useTranslation();
  return (
    <div>
      <TabNav label={t('nav.administration')} items={ADMIN_SECTIONS.map((s) => ({ ...s, label: t(`nav.${s.label}`) }))} />
      <Outlet />
    </div>
  );
}
