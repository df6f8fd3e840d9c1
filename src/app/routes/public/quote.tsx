import { useState } from 'react';
import { useNavigate, useParams } from 'react-router';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useTranslation } from 'react-i18next';
import { CheckCircle2, FileText, Loader2 } from 'lucide-react';
import { acceptQuoteBodySchema, type AcceptQuoteBody, type PublicQuote } from '@shared/schemas/quotes';
import { useAcceptQuote, usePublicQuote } from '@/features/customer-status/api/public-quote';
import { PortalCard as Card, PortalFrame, usePortalFormats } from '@/features/customer-status/components/portal-frame';
import { Button } from '@/components/ui/button';
import { ApiError } from '@/lib/api-client';

// The page a customer opens from the quotation mail: the spec, the price of each quantity with its
// ship dates, and one button to accept a quantity with her name. Accepting places the order from
// the quote (nothing retyped) and opens her order page, where she pays and approves the proof.

function Frame({ children }: { children: React.ReactNode }) {
  const { t } = useTranslation('portal');
  return <PortalFrame title={t('quote.title')}>{children}</PortalFrame>;
}

function Spec({ q }: { q: PublicQuote }) {
  const { t } = useTranslation(['portal', 'common']);
  const s = q.spec;
  const row = (label: string, value: React.ReactNode) => (
    <>
      <dt className="text-harbour-700">{label}</dt>
      <dd className="font-bold text-ink">{value}</dd>
    </>
  );
  return (
    <Card id="spec" heading={t('quote.specHeading')}>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2">
        {row(t('quote.process'), t(`common:process.${s.process}` as 'common:process.hard_enamel', { defaultValue: s.process }))}
        {row(t('quote.material'), t(`common:material.${s.material}` as 'common:material.iron', { defaultValue: s.material }))}
        {row(t('quote.size'), t('quote.sizeValue', { size: s.sizeMm, height: s.heightMm, thickness: s.thicknessMm }))}
        {row(
          t('quote.colours'),
          s.colours.length ? (
            <ul className="flex flex-col gap-1">
              {s.colours.map((c, i) => (
                <li key={i} className="flex items-center gap-2">
                  {c.hex && <span aria-hidden className="inline-block h-4 w-4 rounded-full border border-harbour-100" style={{ background: c.hex }} />}
                  {c.name}
                  {c.ref ? ` (${c.ref})` : ''}
                </li>
              ))}
            </ul>
          ) : (
            t('quote.noColours')
          ),
        )}
        {row(t('quote.plating'), t(`common:plating.${s.plating}` as 'common:plating.gold', { defaultValue: s.plating }))}
        {row(t('quote.backing'), t('quote.backingValue', { count: s.backing.count, type: t(`common:backing.${s.backing.type}` as 'common:backing.butterfly_clutch', { defaultValue: s.backing.type }) }))}
        {s.backLogo && row(t('quote.backLogo'), '✓')}
        {row(t('quote.packaging'), t(`common:packaging.${s.packaging}` as 'common:packaging.bulk', { defaultValue: s.packaging }))}
      </dl>
      {s.overrunPct > 0 && <p className="text-sm text-harbour-700">{t('quote.overrun', { pct: s.overrunPct })}</p>}
    </Card>
  );
}

function AcceptForm({ token, q, quantity }: { token: string; q: PublicQuote; quantity: number | null }) {
  const { t } = useTranslation('portal');
  const f = usePortalFormats();
  const navigate = useNavigate();
  const accept = useAcceptQuote(token);
  const form = useForm<AcceptQuoteBody>({ resolver: zodResolver(acceptQuoteBodySchema), defaultValues: { quantity: quantity ?? 0, name: q.contactName ?? '' } });
  const line = q.lines.find((l) => l.quantity === quantity);
  const errorCode = accept.error instanceof ApiError ? accept.error.code : null;
  const submit = form.handleSubmit((body) =>
    accept.mutate(body, {
      onSuccess: (r) => navigate(`/status/${encodeURIComponent(r.statusToken)}`, { replace: true }),
    }),
  );
  if (accept.isSuccess) {
    return (
      <p role="status" className="flex items-center gap-2 font-bold text-ok-700">
        <CheckCircle2 className="h-6 w-6" aria-hidden /> {t('quote.placed', { order: accept.data.number })}
      </p>
    );
  }
  return (
    <form
      noValidate
      onSubmit={(e) => {
        form.setValue('quantity', quantity ?? 0);
        void submit(e);
      }}
      className="flex flex-col gap-3"
    >
      <p className="text-harbour-700">{t('quote.acceptIntro')}</p>
      <label className="flex flex-col gap-1 font-bold text-harbour-900" htmlFor="accept-name">
        {t('quote.nameLabel')}
        <input
          id="accept-name"
          autoComplete="name"
          className="min-h-11 rounded-lg border-2 border-harbour-100 px-3 text-lg font-normal text-ink"
          aria-invalid={!!form.formState.errors.name}
          {...form.register('name')}
        />
      </label>
      {form.formState.errors.name && (
        <p role="alert" className="text-sm font-bold text-stop-700">
          {t('quote.nameError')}
        </p>
      )}
      {!line && form.formState.isSubmitted && (
        <p role="alert" className="text-sm font-bold text-stop-700">
          {t('quote.chooseError')}
        </p>
      )}
      <Button type="submit" size="lg" disabled={accept.isPending || !line}>
        {accept.isPending ? t('quote.accepting') : line ? t('quote.accept', { count: line.quantity, total: f.money(line.total, q.currency) }) : t('quote.acceptPick')}
      </Button>
      {accept.error && (
        <p role="alert" className="font-bold text-stop-700">
          {errorCode === 'quote_accepted' || errorCode === 'quote_expired' || errorCode === 'quantity_not_quoted' ? t(`quote.errors.${errorCode}`) : t('quote.errors.other')}
        </p>
      )}
    </form>
  );
}

export function Component() {
  const { token = '' } = useParams();
  const { t } = useTranslation('portal');
  const f = usePortalFormats();
  const query = usePublicQuote(token);
  const [chosen, setChosen] = useState<number | null>(null);

  if (query.isPending) {
    return (
      <Frame>
        <p role="status" className="flex items-center gap-2 text-harbour-700">
          <Loader2 className="h-5 w-5 animate-spin" aria-hidden /> {t('quote.loading')}
        </p>
      </Frame>
    );
  }
  if (query.error) {
    const status = query.error instanceof ApiError ? query.error.status : 0;
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
  const q = query.data;
  const open = q.status === 'sent' || q.status === 'draft';
  return (
    <Frame>
      <header className="rounded-xl bg-harbour-800 p-5 text-white">
        <p className="text-sm font-bold uppercase tracking-wide text-brass-300">{q.factory}</p>
        <h1 className="mt-1 text-2xl font-bold leading-tight">{q.title}</h1>
        <p className="mt-1 text-lg">{q.customer}</p>
        <p className="mt-1 text-sm">
          {t('quote.number', { number: q.number, version: q.version })} · {t('quote.validUntil', { date: f.day(q.validUntil) })}
        </p>
      </header>

      {q.accepted && (
        <Card id="accepted" heading={t('quote.acceptedHeading')} icon={<CheckCircle2 className="h-6 w-6 text-ok-700" aria-hidden />}>
          <p data-testid="quote-accepted">
            {t('quote.acceptedBy', { name: q.accepted.name, date: f.day(q.accepted.at), count: q.accepted.quantity, order: q.accepted.orderNumber })}
          </p>
        </Card>
      )}
      {q.status === 'expired' && !q.accepted && (
        <div role="alert" className="rounded-xl border-2 border-warn-700/40 bg-warn-50 p-5">
          <h2 className="text-lg font-bold text-harbour-900">{t('quote.expiredHeading')}</h2>
          <p className="mt-1">{t('quote.expired', { date: f.day(q.validUntil) })}</p>
        </div>
      )}

      <Spec q={q} />

      <Card id="prices" heading={t('quote.pricesHeading')}>
        <p className="text-harbour-700">{q.mouldCharge > 0 ? t('quote.pricesIntro', { moulds: f.money(q.mouldCharge, q.currency) }) : t('quote.noMoulds')}</p>
        <fieldset className="flex flex-col gap-3" disabled={!open}>
          <legend className="sr-only">{t('quote.pricesHeading')}</legend>
          {q.lines.map((l) => {
            const selected = chosen === l.quantity || q.accepted?.quantity === l.quantity;
            return (
              <label
                key={l.quantity}
                className={`flex cursor-pointer items-start gap-3 rounded-lg border-2 p-3 ${selected ? 'border-harbour-800 bg-harbour-50' : 'border-harbour-100 bg-white'}`}
                data-testid={`break-${l.quantity}`}
              >
                <input type="radio" name="quantity" className="mt-1.5 h-5 w-5 shrink-0" checked={selected} onChange={() => setChosen(l.quantity)} />
                <span className="flex flex-1 flex-col">
                  <span className="flex flex-wrap items-baseline justify-between gap-x-3">
                    <span className="text-lg font-bold text-ink">{t('quote.pieces', { count: l.quantity })}</span>
                    <span className="text-lg font-bold text-ink">{t('quote.total', { total: f.money(l.total, q.currency) })}</span>
                  </span>
                  <span className="text-sm text-harbour-700">{t('quote.unit', { price: f.money(l.unitPrice, q.currency) })}</span>
                  <span className="text-sm text-harbour-700">
                    {l.expectedShipAt && l.p85ShipAt ? t('quote.ships', { date: f.day(l.expectedShipAt), p85: f.day(l.p85ShipAt) }) : t('quote.shipsUnknown')}
                  </span>
                </span>
              </label>
            );
          })}
        </fieldset>
      </Card>

      {q.notes && (
        <Card id="notes" heading={t('quote.notesHeading')} icon={<FileText className="h-6 w-6" aria-hidden />}>
          <p className="whitespace-pre-line">{q.notes}</p>
        </Card>
      )}

      {open && (
        <Card id="accept" heading={t('quote.acceptHeading')}>
          <AcceptForm token={token} q={q} quantity={chosen} />
        </Card>
      )}
    </Frame>
  );
}
