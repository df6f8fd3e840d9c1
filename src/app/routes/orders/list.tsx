import { Link } from 'react-router';
import { useTranslation } from 'react-i18next';
import { FilePlus2, Upload } from 'lucide-react';
import { FLOOR_LEADS, PLANNING } from '@shared/domain/access';
import { actionReasons } from '@shared/domain/order-search';
import { queryClient } from '@/lib/query-client';
import { errorText } from '@/lib/error-text';
import { ordersQueryOptions, useOrders } from '@/features/orders/api/get-orders';
import { OrdersTable, useOrderFilters } from '@/features/orders/components/orders-table';
import { useMe } from '@/features/auth/api/get-me';
import { EmptyState, ErrorPanel, Loading, PageHeader } from '@/components/ui/panels';
import { paths } from '@/config/paths';

export const handle = { roles: FLOOR_LEADS };
export const loader = () => queryClient.ensureQueryData(ordersQueryOptions());

const action = 'inline-flex min-h-11 items-center gap-2 rounded-lg px-4 font-bold';
const tab = (on: boolean) =>
  `-mb-0.5 flex min-h-11 items-center border-b-4 px-3 font-bold ${on ? 'border-brass-400 text-harbour-900' : 'border-transparent text-harbour-700 hover:text-harbour-900'}`;

export function Component() {
  const { t } = useTranslation('orders');
  const orders = useOrders();
  const me = useMe();
  const filters = useOrderFilters();
  const mayPlan = !!me.data && PLANNING.includes(me.data.user.role);
  // planners open on what waits for them; everyone else on all orders
  const view = filters.view || (mayPlan ? 'action' : 'all');
  const all = orders.data ?? [];
  const needsAction = all.filter((o) => actionReasons(o).length > 0);
  const shown = view === 'action' ? needsAction : all;
  return (
    <>
      <PageHeader
        title={t('list.title')}
        subtitle={t('list.subtitle')}
        actions={
          mayPlan && (
            <>
              <Link className={`${action} bg-harbour-800 text-white hover:bg-harbour-700`} to={paths.newOrder}>
                <FilePlus2 className="h-5 w-5" aria-hidden /> {t('list.newOrder')}
              </Link>
              <Link className={`${action} border-2 border-harbour-800 bg-white text-harbour-800 hover:bg-harbour-50`} to={paths.importOrders}>
                <Upload className="h-5 w-5" aria-hidden /> {t('list.importCsv')}
              </Link>
            </>
          )
        }
      />
      {orders.isPending ? (
        <Loading />
      ) : orders.error ? (
        <ErrorPanel message={errorText(orders.error)} />
      ) : (
        <>
          <nav aria-label={t('list.tabs')} className="mb-4 flex gap-1 border-b-2 border-harbour-100">
            <button
              type="button"
              aria-current={view === 'action' ? 'page' : undefined}
              className={tab(view === 'action')}
              onClick={() => filters.set('view', 'action')}
            >
              {t('list.tabAction', { count: needsAction.length })}
            </button>
            <button type="button" aria-current={view === 'all' ? 'page' : undefined} className={tab(view === 'all')} onClick={() => filters.set('view', 'all')}>
              {t('list.tabAll', { count: all.length })}
            </button>
          </nav>
          {view === 'action' && needsAction.length === 0 ? (
            <EmptyState title={t('list.actionNone')} />
          ) : (
            <OrdersTable orders={shown} showReasons={view === 'action'} />
          )}
        </>
      )}
    </>
  );
}
