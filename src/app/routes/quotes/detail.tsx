import { useState } from 'react';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router';
import { useTranslation } from 'react-i18next';
import { currentLocale } from '@/lib/i18n';
import { formatAnyDay } from '@/lib/datetime';
import { Copy, FileDown, Link2Off, Pencil, Send } from 'lucide-react';
import { QUOTING } from '@shared/domain/access';
import type { QuoteLineView, QuoteView } from '@shared/schemas/quotes';
import { queryClient } from '@/lib/query-client';
import { errorText } from '@/lib/error-text';
import { quotePdfUrl, quoteQueryOptions, useQuote, useSendQuote, useWithdrawQuoteLink } from '@/features/quotes/api/quotes';
import { Button } from '@/components/ui/button';
import { Card, ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';

export const handle = { roles: QUOTING };
export const loader = ({ params }: LoaderFunctionArgs) => queryClient.ensureQueryData(quoteQueryOptions(params.id!));

const tone = { draft: 'neutral', sent: 'info', accepted: 'ok', expired: 'warn' } as const;
const action = 'inline-flex min-h-11 items-center gap-2 rounded-lg px-4 font-bold';
const num = 'px-2 py-1.5 text-right tabular-nums';

function useFormats() {
  const { i18n } = useTranslation();
  const lang = i18n.language;
  return {
    money: (x: number, c: string, digits?: number) =>
      new Intl.NumberFormat(lang, { style: 'currency', currency: c, minimumFractionDigits: digits, maximumFractionDigits: digits }).format(x),
    day: (iso: string) => formatAnyDay(iso, currentLocale()),
    n: (x: number, digits = 1) => x.toLocaleString(lang, { maximumFractionDigits: digits }),
  };
}

function Breakdown({ q, line }: { q: QuoteView; line: QuoteLineView }) {
  const { t } = useTranslation(['quotes', 'common']);
  const f = useFormats();
  const b = line.breakdown;
  const m = (x: number) => f.money(x, q.currency, 4);
  const parts: [string, number][] = [
    [t('detail.part.material'), b.material],
    [t('detail.part.labour'), b.labour],
    [t('detail.part.oven', { cycles: line.ovenCycles }), b.oven],
    [t('detail.part.plating'), b.plating],
    [t('detail.part.fittings'), b.fittings],
    [t('detail.part.packaging'), b.packaging],
    [t('detail.part.margin'), b.margin],
  ];
  return (
    <Card>
      <h2 className="mb-3 text-xl font-bold text-harbour-900">{t('detail.breakdownHeading', { count: line.quantity })}</h2>
      <div className="grid gap-6 xl:grid-cols-[2fr_3fr]">
        <table className="w-full text-left text-sm" data-testid="breakdown">
          <caption className="mb-1 text-left text-sm text-harbour-700">{t('detail.breakdownCaption')}</caption>
          <tbody>
            {parts.map(([label, value]) => (
              <tr key={label} className="border-b border-harbour-50">
                <th scope="row" className="px-2 py-1.5 font-normal">
                  {label}
                </th>
                <td className={num}>{m(value)}</td>
              </tr>
            ))}
            <tr className="border-t-2 border-harbour-100">
              <th scope="row" className="px-2 py-1.5">
                {t('detail.part.unitPrice')}
              </th>
              <td className={`${num} font-bold`}>{m(line.unitPrice)}</td>
            </tr>
          </tbody>
        </table>
        <div className="max-h-96 overflow-auto" tabIndex={0} aria-label={t('detail.stepsCaption', { count: line.madePieces })}>
          <table className="w-full text-left text-sm">
            <caption className="mb-1 text-left text-sm text-harbour-700">{t('detail.stepsCaption', { count: line.madePieces })}</caption>
            <thead className="sticky top-0 bg-white">
              <tr className="border-b-2 border-harbour-100">
                <th scope="col" className="px-2 py-1">
                  {t('detail.stepCol.step')}
                </th>
                <th scope="col" className="px-2 py-1 text-right">
                  {t('detail.stepCol.minutes')}
                </th>
                <th scope="col" className="px-2 py-1 text-right">
                  {t('detail.stepCol.cost')}
                </th>
              </tr>
            </thead>
            <tbody>
              {line.steps.map((s) => (
                <tr key={s.seq} className="border-b border-harbour-50">
                  <th scope="row" className="px-2 py-1 font-normal">
                    {s.seq}. {t(`common:kind.${s.stationKind}` as 'common:kind.fill', { defaultValue: s.stationKind })}{' '}
                    <span className="text-xs text-harbour-700">{s.name}</span>
                  </th>
                  <td className={num}>{f.n(s.minutes)}</td>
                  <td className={num}>{f.money(s.cost, q.currency)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </div>
    </Card>
  );
}

export function Component() {
  const { id } = useParams();
  const { t } = useTranslation(['quotes', 'common']);
  const f = useFormats();
  const quote = useQuote(id!);
  const send = useSendQuote(id!);
  const withdraw = useWithdrawQuoteLink(id!);
  const [chosen, setChosen] = useState<number | null>(null);
  if (quote.isPending) return <Loading />;
  if (quote.error) return <ErrorPanel message={errorText(quote.error)} />;
  const q = quote.data;
  const m = (x: number) => f.money(x, q.currency);
  const line = q.lines.find((l) => l.quantity === chosen) ?? q.lines[Math.min(q.lines.length - 1, 2)] ?? q.lines[0];
  const open = q.status === 'draft' || q.status === 'sent';
  const liveLinks = q.links.filter((l) => !l.revokedAt);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title={`${q.number} · ${q.spec.title}`}
        subtitle={
          <span className="flex flex-wrap items-center gap-2">
            {t('detail.forCustomer', { customer: q.customer.name, contact: q.contactName ? `${q.contactName} <${q.contactEmail}>` : q.contactEmail })} ·{' '}
            {t('detail.version', { version: q.version })} · {t('detail.validUntil', { date: f.day(q.validUntil) })}
            <Pill tone={tone[q.status]}>{t(`status.${q.status}`)}</Pill>
          </span>
        }
        actions={
          <>
            {open && (
              <Button onClick={() => send.mutate()} disabled={send.isPending}>
                <Send className="h-5 w-5" aria-hidden /> {send.isPending ? t('detail.sending') : q.sentAt ? t('detail.sendAgain') : t('detail.send')}
              </Button>
            )}
            <a
              className={`${action} border-2 border-harbour-800 bg-white text-harbour-800 hover:bg-harbour-50`}
              href={quotePdfUrl(q.id)}
              target="_blank"
              rel="noreferrer"
            >
              <FileDown className="h-5 w-5" aria-hidden /> {t('detail.pdf')}
            </a>
            {open && (
              <Link className={`${action} text-harbour-800 hover:bg-harbour-50`} to={`/quotes/new?revise=${q.id}`}>
                <Pencil className="h-5 w-5" aria-hidden /> {t('detail.revise')}
              </Link>
            )}
            <Link className={`${action} text-harbour-800 hover:bg-harbour-50`} to={`/quotes/new?fromQuote=${q.id}`}>
              <Copy className="h-5 w-5" aria-hidden /> {t('detail.duplicate')}
            </Link>
          </>
        }
      />
      {send.error && <ErrorPanel message={errorText(send.error)} />}
      {send.data && (
        <p role="status" className="break-all rounded-lg bg-ok-50 p-3 font-bold text-ok-700" data-testid="sent-link">
          {t('detail.sent', { url: send.data.url })}
        </p>
      )}
      {q.accepted && (
        <Card>
          <p className="text-lg" data-testid="accepted">
            {t('detail.acceptedBy', { name: q.accepted.name, date: f.day(q.accepted.at), count: q.accepted.quantity, order: q.accepted.orderNumber })}{' '}
            <Link className="font-bold text-harbour-800 underline" to={`/orders/${q.accepted.orderId}`}>
              {t('detail.openOrder', { order: q.accepted.orderNumber })}
            </Link>
          </p>
        </Card>
      )}

      <Card>
        <h2 className="mb-1 text-xl font-bold text-harbour-900">{t('detail.pricesHeading')}</h2>
        <p className="text-sm text-harbour-700">
          {t('detail.perPiece', { grams: f.n(q.materialGrams, 2), dm2: f.n(q.platedDm2, 4) })} · {t('detail.moulds', { charge: m(q.mouldCharge) })}
        </p>
        <ul className="mb-3 text-sm text-harbour-700">
          {q.moulds.map((md) => (
            <li key={md.side}>
              {md.reuse
                ? t('detail.mouldReused', { side: t(`detail.mouldSide_${md.side}`) })
                : t('detail.mouldSide', { side: t(`detail.mouldSide_${md.side}`), hours: f.n(md.hours, 2), charge: m(md.charge) })}
            </li>
          ))}
        </ul>
        <div className="overflow-x-auto" tabIndex={0} aria-label={t('detail.pricesCaption')}>
          <table className="w-full text-left text-sm" data-testid="quote-lines">
            <caption className="sr-only">{t('detail.pricesCaption')}</caption>
            <thead>
              <tr className="border-b-2 border-harbour-100">
                {(['quantity', 'made', 'unitPrice', 'goods', 'moulds', 'total', 'expected', 'p85'] as const).map((k) => (
                  <th key={k} scope="col" className="px-2 py-2 text-right">
                    {t(`detail.col.${k}`)}
                  </th>
                ))}
                <th scope="col" className="px-2 py-2">
                  <span className="sr-only">{t('detail.showBreak')}</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {q.lines.map((l) => (
                <tr key={l.quantity} className={`border-b border-harbour-50 ${l === line ? 'bg-harbour-50' : ''}`}>
                  <th scope="row" className={`${num} font-bold`}>
                    {l.quantity.toLocaleString()}
                  </th>
                  <td className={num}>{l.madePieces.toLocaleString()}</td>
                  <td className={num}>{f.money(l.unitPrice, q.currency, 3)}</td>
                  <td className={num}>{m(l.goodsTotal)}</td>
                  <td className={num}>{m(l.mouldCharge)}</td>
                  <td className={`${num} font-bold`}>{m(l.total)}</td>
                  <td className={num}>{l.shipDates.expectedAt ? f.day(l.shipDates.expectedAt) : '–'}</td>
                  <td className={num}>{l.shipDates.p85At ? f.day(l.shipDates.p85At) : '–'}</td>
                  <td className="px-2 py-1">
                    <Button variant="ghost" aria-pressed={l === line} onClick={() => setChosen(l.quantity)}>
                      {t('detail.showBreak')}
                    </Button>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <details className="mt-2 text-sm text-harbour-700">
          <summary className="cursor-pointer font-bold">{t('detail.shipBasis')}</summary>
          <p className="mt-1">{q.shipDateBasis}</p>
        </details>
      </Card>

      {line && <Breakdown q={q} line={line} />}

      <Card>
        <h2 className="mb-2 text-lg font-bold text-harbour-900">{t('detail.versions')}</h2>
        <ul className="text-sm">
          {q.versions.map((v) => (
            <li key={v.version}>
              {t('detail.versionLine', {
                version: v.version,
                date: f.day(v.createdAt),
                by: v.createdBy ?? '–',
                quantities: v.quantities.join(' · '),
                valid: f.day(v.validUntil),
              })}
            </li>
          ))}
        </ul>
        {q.links.length > 0 && (
          <>
            <h2 className="mb-2 mt-4 text-lg font-bold text-harbour-900">{t('detail.links')}</h2>
            <ul className="text-sm">
              {q.links.map((l) => (
                <li key={l.id}>
                  {t('detail.linkLine', { date: f.day(l.createdAt) })}
                  {l.lastOpenedAt ? ` · ${t('detail.linkOpened', { date: f.day(l.lastOpenedAt) })}` : ''}
                  {l.revokedAt ? ` · ${t('detail.linkRevoked', { date: f.day(l.revokedAt) })}` : ''}
                </li>
              ))}
            </ul>
            {liveLinks.length > 0 && (
              <Button className="mt-2" variant="ghost" disabled={withdraw.isPending} onClick={() => withdraw.mutate()}>
                <Link2Off className="h-5 w-5" aria-hidden /> {t('detail.withdraw')}
              </Button>
            )}
            {withdraw.isSuccess && <p role="status">{t('detail.withdrawn')}</p>}
          </>
        )}
      </Card>
    </div>
  );
}
