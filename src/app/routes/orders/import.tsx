import { useTranslation } from 'react-i18next';
import { PLANNING } from '@shared/domain/access';
import { ImportPanel } from '@/features/orders/components/import-panel';
import { PageHeader } from '@/components/ui/panels';

export const handle = { roles: PLANNING };

export function Component() {
  const { t } = useTranslation('orders');
  return (
    <>
      <PageHeader title={t('import.title')} subtitle={t('import.subtitle')} />
      <ImportPanel />
    </>
  );
}
