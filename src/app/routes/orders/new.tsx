import { useNavigate, useSearchParams } from 'react-router';
import { factoryDateInDays } from '@/lib/datetime';
import { useTranslation } from 'react-i18next';
import { PLANNING } from '@shared/domain/access';
import { errorText } from '@/lib/error-text';
import type { OrderSpecInput } from '@shared/schemas/orders';
import { useCreateOrder } from '@/features/orders/api/save-order';
import { useQuery } from '@tanstack/react-query';
import { orderQueryOptions } from '@/features/orders/api/get-order';
import { OrderForm } from '@/features/orders/components/order-form';
import { WhatIfPanel } from '@/features/projections/components/what-if-panel';
import { Card, Loading, PageHeader } from '@/components/ui/panels';
import { paths } from '@/config/paths';

export const handle = { roles: PLANNING };

/** A new order; with ?repeat=<order id> the form starts from that order's spec and reuses its moulds. */
export function Component() {
  const { t } = useTranslation('orders');
  const navigate = useNavigate();
  const [search] = useSearchParams();
  const repeatOf = search.get('repeat');
  const earlier = useQuery({ ...orderQueryOptions(repeatOf ?? ''), enabled: !!repeatOf });
  const create = useCreateOrder();
  if (repeatOf && earlier.isPending) return <Loading />;
  const initial: Partial<OrderSpecInput> | undefined =
    repeatOf && earlier.data
      ? { ...earlier.data.spec, customer: earlier.data.customer.name, reorderOf: earlier.data.id, dueDate: factoryDateInDays(28) }
      : undefined;
  return (
    <>
      <PageHeader
        title={initial ? t('form.repeatTitle', { number: earlier.data!.number }) : t('form.newTitle')}
        subtitle={initial ? t('form.repeatSubtitle') : t('form.newSubtitle')}
      />
      <Card>
        <OrderForm
          initial={initial}
          submitLabel={t('form.save')}
          pending={create.isPending}
          error={create.error && errorText(create.error)}
          onSubmit={(spec) => create.mutate(spec, { onSuccess: (order) => navigate(paths.order(order.id)) })}
          onCancel={() => navigate(paths.orders)}
          extra={(withSpec) => <WhatIfPanel withSpec={withSpec} />}
        />
      </Card>
    </>
  );
}
