import { useParams, useSearchParams } from 'react-router';
import { useTranslation } from 'react-i18next';
import { CheckCircle2, CreditCard, Loader2, PackageCheck, Truck } from 'lucide-react';
import { usePublicOrder } from '@/features/customer-status/api/get-public-order';
import { useStartCheckout } from '@/features/customer-status/api/portal-actions';
import { ProofCard } from '@/features/customer-status/components/proof-card';
import { Button } from '@/components/ui/button';
import { ApiError } from '@/lib/api-client';
import { PortalCard, PortalFrame, usePortalFormats } from '@/features/customer-status/components/portal-frame';
import type { PublicOrder } from '@shared/schemas/shipping';
import { formatInstant } from '@shared/domain/time-format';
import { currentLocale } from '@/lib/i18n';

// The page a customer opens from the link the factory sent: one order, made for a phone, in
// English or Chinese. She pays what is due, approves her proof or asks for changes, and follows
// her own pins being made. It shows only what the public order answer holds; no sign-in, no
// navigation into the app.

const useFormats = usePortalFormats;

function Frame({ children }: { children: React.ReactNode }) {
  const { t } = useTranslation('portal');
  return <PortalFrame title={t('title')}>{children}</PortalFrame>;
}

const Card = PortalCard;

function PayCard({ token, o, confirming }: { token: string; o: PublicOrder; confirming: boolean }) {
  const { t } = useTranslation('portal');
  const f = useFormats();
  const checkout = useStartCheckout(token);
  if (o.status === 'cancelled') return null;
  const paidSome = o.paidTotal > 0;
  const due = o.amountDue;
  return (
    <Card id="pay" heading={t('pay.heading')} icon={<CreditCard className="h-6 w-6" aria-hidden />}>
      {due == null ? (
        o.status === 'awaiting_payment' ? (
          <p>{t('pay.noPrice')}</p>
        ) : (
          <p className="flex items-center gap-2 font-bold text-ok-700">
            <CheckCircle2 className="h-6 w-6" aria-hidden /> {t('pay.received')}
          </p>
        )
      ) : due > 0 ? (
        <>
          <p className="text-harbour-700">{t('pay.due')}</p>
          <p className="text-3xl font-bold text-ink" data-testid="amount-due">
            {f.money(due, o.currency)}
          </p>
          {o.depositPct < 100 && o.priceTotal != null && <p className="text-sm text-harbour-700">{t('pay.deposit', { pct: o.depositPct, price: f.money(o.priceTotal, o.currency) })}</p>}
          {paidSome && <p className="text-sm text-harbour-700">{t('pay.balance', { paid: f.money(o.paidTotal, o.currency) })}</p>}
          {confirming && o.status === 'awaiting_payment' && (
            <p role="status" className="rounded bg-warn-50 p-2">
              {t('pay.confirming')}
            </p>
          )}
          {o.canPay ? (
            <Button size="lg" onClick={() => checkout.mutate()} disabled={checkout.isPending || checkout.isSuccess}>
              {checkout.isPending || checkout.isSuccess ? t('pay.opening') : t('pay.button', { amount: f.money(due, o.currency) })}
            </Button>
          ) : (
            <p>{t('pay.unavailable')}</p>
          )}
          {checkout.error && (
            <p role="alert" className="font-bold text-stop-700">
              {checkout.error.message}
            </p>
          )}
        </>
      ) : (
        <p className="flex items-center gap-2 font-bold text-ok-700" data-testid="paid">
          <CheckCircle2 className="h-6 w-6" aria-hidden /> {t('pay.paid', { paid: f.money(o.paidTotal, o.currency) })}
        </p>
      )}
    </Card>
  );
}

function Stages({ o }: { o: PublicOrder }) {
  const { t } = useTranslation('portal');
  const f = useFormats();
  const current = o.stages.find((s) => !s.done);
  const stageName = (key: string) => t(`stages.${key}` as 'stages.colour');
  return (
    <Card id="stage" heading={t('stages.heading')}>
      <p className="text-lg font-bold" data-testid="stage">
        {t('stages.now', { stage: o.status === 'cancelled' ? t('stages.cancelled') : stageName(current?.key ?? 'shipped') })}
      </p>
      <ol aria-label={t('stages.list')} className="flex flex-col gap-2">
        {o.stages.map((s, i) => {
          const now = !s.done && s.key === current?.key && o.status !== 'cancelled';
          return (
            <li key={s.key} aria-current={now ? 'step' : undefined} className="flex min-h-11 items-center gap-3">
              <span
                aria-hidden
                className={`flex h-8 w-8 shrink-0 items-center justify-center rounded-full border-2 font-bold ${s.done ? 'border-ok-700 bg-ok-700 text-white' : now ? 'border-brass-700 bg-brass-300 text-harbour-900' : 'border-harbour-100 bg-white text-harbour-700'}`}
              >
                {s.done ? '✓' : i + 1}
              </span>
              <span className={`text-lg ${now ? 'font-bold text-harbour-900' : s.done ? 'text-ink' : 'text-harbour-700'}`}>{stageName(s.key)}</span>
              <span className="ml-auto text-sm font-bold text-harbour-700">{s.done ? (s.at ? t('stages.done', { date: f.day(s.at) }) : '✓') : now ? t('stages.current') : ''}</span>
            </li>
          );
        })}
      </ol>
    </Card>
  );
}

function Story({ o }: { o: PublicOrder }) {
  const { t, i18n } = useTranslation('portal');
  const f = useFormats();
  const zh = i18n.language === 'zh-CN';
  return (
    <Card id="story" heading={t('story.heading')}>
      {!o.story?.length ? (
        <p>{t('story.notYet')}</p>
      ) : (
        <>
          <p className="text-harbour-700">{t('story.intro')}</p>
          <ol className="flex flex-col gap-4">
            {o.story.map((s) => (
              <li key={s.stage} className="border-l-4 border-harbour-100 pl-3">
                <h3 className="font-bold text-harbour-900">{t(`stages.${s.stage}` as 'stages.colour')}</h3>
                <p className="text-sm text-harbour-700">
                  {t('story.began', { date: f.day(s.at) })}
                  {s.doneAt ? ` · ${t('story.ended', { date: f.day(s.doneAt) })}` : ''}
                </p>
                <p className="mt-1 text-ink">{zh ? s.textZh : s.text}</p>
                {s.photos.length > 0 && (
                  <div className="mt-2 grid grid-cols-2 gap-2">
                    {s.photos.map((url) => (
                      <img key={url} src={url} loading="lazy" alt={t('story.photoAlt', { stage: t(`stages.${s.stage}` as 'stages.colour') })} className="aspect-square w-full rounded border border-harbour-100 object-cover" />
                    ))}
                  </div>
                )}
              </li>
            ))}
          </ol>
          <p className="text-sm text-harbour-700">{t('safety')}</p>
        </>
      )}
    </Card>
  );
}

export function Component() {
  const { token = '' } = useParams();
  const [search] = useSearchParams();
  const confirming = search.get('paid') === '1';
  const { t } = useTranslation('portal');
  const f = useFormats();
  const query = usePublicOrder(token, confirming);

  if (query.isPending) {
    return (
      <Frame>
        <p role="status" className="flex items-center gap-2 text-harbour-700">
          <Loader2 className="h-5 w-5 animate-spin" aria-hidden /> {t('loading')}
        </p>
      </Frame>
    );
  }
  if (query.error) {
    const e = query.error;
    const status = e instanceof ApiError ? e.status : 0;
    const [title, text] =
      status === 404 ? [t('errors.goneTitle'), t('errors.gone')] : status === 410 ? [t('errors.expiredTitle'), t('errors.gone')] : status === 429 ? [t('errors.busyTitle'), t('errors.busy')] : [t('errors.otherTitle'), t('errors.other')];
    return (
      <Frame>
        <div role="alert" className="rounded-xl border-2 border-harbour-100 bg-white p-5">
          <h1 className="text-2xl font-bold text-harbour-900">{title}</h1>
          <p className="mt-2 text-ink">{text}</p>
        </div>
      </Frame>
    );
  }
  const o = query.data;
  const shipped = !!o.shippedAt;
  const answerable = o.status === 'awaiting_payment' || o.status === 'awaiting_proof' || o.status === 'ready';
  return (
    <Frame>
      <header className="rounded-xl bg-harbour-800 p-5 text-white">
        <p className="text-sm font-bold uppercase tracking-wide text-brass-300">{o.factory}</p>
        <h1 className="mt-1 text-2xl font-bold leading-tight">{o.title}</h1>
        <p className="mt-1 text-lg">{o.customer}</p>
        <p className="mt-1 text-sm">
          {t('orderNumber', { number: o.number })} · {t('pieces', { count: o.quantity })}
        </p>
        {/* her own clock, with the zone named: she may be anywhere */}
        <p className="mt-1 text-sm" data-testid="updated-at">
          {t('updated', { time: formatInstant(o.updatedAt, { locale: currentLocale(), timeZone: undefined }, 'dateTime', true) })}
        </p>
        {o.contact && (
          <p className="mt-1 text-sm">
            {t('contact')}{' '}
            <a className="font-bold underline" href={`mailto:${o.contact}?subject=${encodeURIComponent(t('orderNumber', { number: o.number }))}`}>
              {o.contact}
            </a>
          </p>
        )}
      </header>

      <PayCard token={token} o={o} confirming={confirming} />

      <Card id="proofs" heading={t('proofs.heading')}>
        {o.proofs.length === 0 ? (
          <p>{t('proofs.none')}</p>
        ) : (
          [...o.proofs].reverse().map((p) => <ProofCard key={p.revision} token={token} proof={p} canAnswer={answerable} day={f.day} />)
        )}
      </Card>

      <Card id="when" heading={shipped ? t('when.shipped') : t('when.expected')} icon={shipped ? <PackageCheck className="h-6 w-6" aria-hidden /> : <Truck className="h-6 w-6" aria-hidden />}>
        <p className="text-2xl font-bold text-ink" data-testid="ship-date">
          {shipped ? f.longDate(o.shippedAt!) : o.projectedShipAt ? f.longDate(o.projectedShipAt) : t('when.later')}
        </p>
        {!shipped && o.projectedShipAt && <p className="text-sm text-harbour-700">{t('when.projectionNote')}</p>}
        {o.carrier && o.trackingNumber && (
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
            <dt className="text-harbour-700">{t('when.carrier')}</dt>
            <dd className="font-bold">{o.carrier}</dd>
            <dt className="text-harbour-700">{t('when.tracking')}</dt>
            <dd className="break-all font-mono text-lg font-bold">
              {o.trackingUrl ? (
                <a className="underline" href={o.trackingUrl} target="_blank" rel="noopener noreferrer" title={t('when.trackingLink')}>
                  {o.trackingNumber}
                </a>
              ) : (
                o.trackingNumber
              )}
            </dd>
            {o.trackingUrl && (
              <dd className="col-span-2">
                <a className="font-bold text-harbour-800 underline" href={o.trackingUrl} target="_blank" rel="noopener noreferrer">
                  {t('when.trackingLink')}
                </a>
              </dd>
            )}
          </dl>
        )}
      </Card>

      <Stages o={o} />
      <Story o={o} />
    </Frame>
  );
}
