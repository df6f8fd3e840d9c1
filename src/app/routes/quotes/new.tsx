import { useNavigate, useSearchParams } from 'react-router';
import { useQuery } from '@tanstack/react-query';
import { useTranslation } from 'react-i18next';
import { QUOTING } from '@shared/domain/access';
import type { OrderDetail } from '@shared/schemas/orders';
import type { QuoteView } from '@shared/schemas/quotes';
import { errorText } from '@/lib/error-text';
import { orderQueryOptions } from '@/features/orders/api/get-order';
import { useOrders } from '@/features/orders/api/get-orders';
import { useCustomers } from '@/features/orders/api/get-customers';
import { quoteQueryOptions, useCreateQuote, useReviseQuote } from '@/features/quotes/api/quotes';
import { QuoteForm, blankQuote, type QuoteFormValues } from '@/features/quotes/components/quote-form';
import { SelectField } from '@/components/ui/field';
import { Card, Loading, PageHeader } from '@/components/ui/panels';

export const handle = { roles: QUOTING };

const breaksOf = (qs: number[]) => Array.from({ length: 6 }, (_, i) => (qs[i] != null ? String(qs[i]) : ''));

/** A past order's spec as a quote's start: a reorder of the same artwork (its stored moulds are reused). */
function fromOrder(o: OrderDetail): QuoteFormValues {
  const b = blankQuote();
  const s = o.spec;
  return {
    ...b,
    customer: o.customer.name,
    spec: {
      ...b.spec,
      title: s.title,
      productType: s.productType,
      process: s.process,
      material: s.material,
      sizeMm: s.sizeMm,
      heightMm: s.sizeMm,
      overrunPct: s.overrunPct,
      colours: s.colours,
      plating: s.plating,
      secondPlating: s.secondPlating,
      backing: s.backing,
      backLogo: s.backLogo,
      printing: s.printing,
      epoxy: s.epoxy,
      sandblast: s.sandblast,
      packaging: s.packaging,
      reorderOf: o.id,
    },
    breaks: breaksOf([s.quantity]),
  };
}

function fromQuote(q: QuoteView, keepCustomer: boolean): QuoteFormValues {
  const b = blankQuote();
  return {
    customer: keepCustomer ? q.customer.name : '',
    contactName: keepCustomer ? (q.contactName ?? '') : '',
    contactEmail: keepCustomer ? q.contactEmail : '',
    spec: q.spec,
    breaks: breaksOf(q.quantities),
    validUntil: keepCustomer && q.validUntil >= b.validUntil ? q.validUntil : b.validUntil,
    notes: q.notes,
  };
}

/** A new quote, blank or from a past order (?fromOrder) or quote (?fromQuote); ?revise makes a new version of one. */
export function Component() {
  const { t } = useTranslation('quotes');
  const navigate = useNavigate();
  const [search, setSearch] = useSearchParams();
  const orderId = search.get('fromOrder');
  const quoteId = search.get('revise') ?? search.get('fromQuote');
  const revising = !!search.get('revise');
  const order = useQuery({ ...orderQueryOptions(orderId ?? ''), enabled: !!orderId });
  const quote = useQuery({ ...quoteQueryOptions(quoteId ?? ''), enabled: !!quoteId });
  const orders = useOrders();
  const customers = useCustomers();
  const create = useCreateQuote();
  const revise = useReviseQuote(quoteId ?? '');
  if ((orderId && order.isPending) || (quoteId && quote.isPending)) return <Loading />;
  const initial = orderId && order.data ? fromOrder(order.data) : quoteId && quote.data ? fromQuote(quote.data, revising) : blankQuote();
  const save = revising ? revise : create;
  return (
    <>
      <PageHeader
        title={revising && quote.data ? t('form.reviseTitle', { number: quote.data.number }) : t('form.newTitle')}
        subtitle={revising && quote.data ? t('form.reviseSubtitle', { version: quote.data.versions.length + 1 }) : t('form.newSubtitle')}
      />
      {!revising && (
        <Card className="mb-4">
          <SelectField
            label={t('form.startFrom')}
            value={orderId ?? ''}
            hint={t('form.startFromHint')}
            onChange={(e) => setSearch(e.target.value ? { fromOrder: e.target.value } : {}, { replace: true })}
          >
            <option value="">{t('form.startFromNone')}</option>
            {orders.data?.map((o) => (
              <option key={o.id} value={o.id}>
                {o.number} · {o.customer} · {o.title}
              </option>
            ))}
          </SelectField>
        </Card>
      )}
      <Card>
        <QuoteForm
          // a new start gives a new form
          key={`${orderId ?? ''}|${quoteId ?? ''}`}
          initial={initial}
          customers={customers.data ?? []}
          submitLabel={t('form.save')}
          pending={save.isPending}
          error={save.error && errorText(save.error)}
          onSubmit={(body) => save.mutate(body, { onSuccess: (q) => navigate(`/quotes/${q.id}`) })}
          onCancel={() => navigate(quoteId ? `/quotes/${quoteId}` : '/quotes')}
        />
      </Card>
    </>
  );
}
