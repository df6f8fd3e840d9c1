import { Link } from 'react-router';
import { FilePlus2, Upload } from 'lucide-react';
import { FLOOR_LEADS, PLANNING } from '@shared/domain/access';
import { queryClient } from '@/lib/query-client';
import { ordersQueryOptions, useOrders } from '@/features/orders/api/get-orders';
import { OrdersTable } from '@/features/orders/components/orders-table';
import { useMe } from '@/features/auth/api/get-me';
import { ErrorPanel, Loading, PageHeader } from '@/components/ui/panels';
import { paths } from '@/config/paths';

export const handle = { roles: FLOOR_LEADS };
export const loader = () => queryClient.ensureQueryData(ordersQueryOptions());

const action = 'inline-flex min-h-11 items-center gap-2 rounded-lg px-4 font-bold';

export function Component() {
  const orders = useOrders();
  const me = useMe();
  const mayPlan = !!me.data && PLANNING.includes(me.data.user.role);
  return (
    <>
      <PageHeader
        title="Orders"
        subtitle="Every order from entry to dispatch. Release needs a payment and an approved proof."
        actions={
          mayPlan && (
            <>
              <Link className={`${action} bg-harbour-800 text-white hover:bg-harbour-700`} to={paths.newOrder}>
                <FilePlus2 className="h-5 w-5" aria-hidden /> New order
              </Link>
              <Link className={`${action} border-2 border-harbour-800 bg-white text-harbour-800 hover:bg-harbour-50`} to={paths.importOrders}>
                <Upload className="h-5 w-5" aria-hidden /> Import CSV
              </Link>
            </>
          )
        }
      />
      {orders.isPending ? <Loading /> : orders.error ? <ErrorPanel message={orders.error.message} /> : <OrdersTable orders={orders.data} />}
    </>
  );
}
