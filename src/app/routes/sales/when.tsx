import { useTranslation } from 'react-i18next';
import { WHAT_IF } from '@shared/domain/access';
import { OrderForm } from '@/features/orders/components/order-form';
import { WhatIfPanel } from '@/features/projections/components/what-if-panel';
import { Card, PageHeader } from '@/components/ui/panels';

export const handle = { roles: WHAT_IF };

/** Sales, before an order is taken: the spec the customer asks for, projected on today's floor and never saved. */
export function Component() {
  const { t } = useTranslation('projections');
  return (
    <>
      <PageHeader title={t('whatIf.pageTitle')} subtitle={t('whatIf.pageSubtitle')} />
      <Card>
        <OrderForm extra={(withSpec) => <WhatIfPanel withSpec={withSpec} />} />
      </Card>
    </>
  );
}
