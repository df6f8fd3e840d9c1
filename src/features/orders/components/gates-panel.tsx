import { useMemo, useRef, useState, type ReactNode } from 'react';
import { Trans, useTranslation } from 'react-i18next';
import type { TFunction } from 'i18next';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { CheckCircle2, CircleDashed, FileText, Upload } from 'lucide-react';
import type { OrderDetail } from '@shared/schemas/orders';
import type { Role } from '@shared/domain/vocabulary';
import { Card, ErrorPanel, Pill } from '@/components/ui/panels';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { formatDate, formatDateTime } from '@/lib/labels';
import { factoryTodayDate } from '@/lib/datetime';
import { errorText } from '@/lib/error-text';
import { proofFileUrl, useApproveProof, useRecordPayment, useUploadProof } from '../api/gates';

type T = TFunction<'orders'>;
const paymentForm = (t: T) =>
  z.object({
    amount: z.number({ error: t('gates.enterAmount') }).positive(t('gates.amountAboveZero')),
    reference: z.string().trim().min(1, t('gates.enterReference')),
  });
const exceptionForm = (t: T) => z.object({ reason: z.string().trim().min(5, t('gates.enterReason')) });
type PaymentValues = z.infer<ReturnType<typeof paymentForm>>;
type ExceptionValues = z.infer<ReturnType<typeof exceptionForm>>;

function Gate({ ok, title, children }: { ok: boolean; title: string; children: ReactNode }) {
  const { t } = useTranslation('orders');
  return (
    <section aria-label={title} className="flex flex-col gap-3">
      <h3 className="flex items-center gap-2 text-lg font-bold text-harbour-900">
        {ok ? <CheckCircle2 className="h-6 w-6 text-ok-700" aria-hidden /> : <CircleDashed className="h-6 w-6 text-warn-700" aria-hidden />}
        {title}
        {ok ? <Pill tone="ok">{t('gates.done')}</Pill> : <Pill tone="warn">{t('gates.open')}</Pill>}
      </h3>
      {children}
    </section>
  );
}

function PaymentGate({ order, role }: { order: OrderDetail; role: Role }) {
  const { t } = useTranslation('orders');
  const pay = useRecordPayment(order.id);
  // the forms' own words in the reader's language (t changes with the language)
  const schemas = useMemo(() => ({ payment: paymentForm(t), exception: exceptionForm(t) }), [t]);
  const form = useForm<PaymentValues>({ resolver: zodResolver(schemas.payment) });
  const exception = useForm<ExceptionValues>({ resolver: zodResolver(schemas.exception) });
  const [showException, setShowException] = useState(false);
  const mayExcept = role === 'manager' || role === 'admin';
  const ok = !order.openGates.includes('payment_missing');
  return (
    <Gate ok={ok || order.releasedAt != null} title={t('gates.payment')}>
      {order.payment.required != null && (
        <p data-testid="payment-due">
          <Trans
            t={t}
            i18nKey="gates.paymentDue"
            values={{
              price: order.payment.priceTotal?.toFixed(2) ?? '—',
              currency: order.payment.currency,
              pct: order.payment.depositPct,
              required: order.payment.required.toFixed(2),
              paid: order.paidTotal.toFixed(2),
              due: (order.payment.amountDue ?? 0).toFixed(2),
            }}
            components={{ strong: <strong /> }}
          />
        </p>
      )}
      {order.payments.length > 0 && (
        <ul className="flex flex-col gap-1">
          {order.payments.map((p) => (
            <li key={p.id}>
              {p.isException ? (
                <Trans t={t} i18nKey="gates.exception" values={{ name: p.recordedBy, note: p.note ?? '' }} components={{ strong: <strong /> }} />
              ) : (
                <>
                  <strong>
                    {p.amount?.toFixed(2)} {p.currency ?? ''}
                  </strong>{' '}
                  · {p.source === 'checkout' ? t('gates.paidOnline') : t('gates.paidBy', { name: p.recordedBy })} · {p.reference} {p.note && `· ${p.note}`}
                </>
              )}{' '}
              <span className="text-sm text-harbour-700">({formatDateTime(p.recordedAt)})</span>
            </li>
          ))}
        </ul>
      )}
      <form
        noValidate
        aria-label={t('gates.recordForm')}
        className="flex flex-wrap items-end gap-3"
        onSubmit={form.handleSubmit((v) => pay.mutate(v, { onSuccess: () => form.reset() }))}
      >
        <TextField
          label={t('gates.amount')}
          type="number"
          step="0.01"
          inputMode="decimal"
          {...form.register('amount', { valueAsNumber: true })}
          error={form.formState.errors.amount?.message}
        />
        <TextField label={t('gates.reference')} {...form.register('reference')} error={form.formState.errors.reference?.message} />
        <Button type="submit" disabled={pay.isPending}>
          {t('gates.record')}
        </Button>
      </form>
      {mayExcept && !ok && (
        <div>
          {showException ? (
            <form
              noValidate
              aria-label={t('gates.exceptionForm')}
              className="flex flex-wrap items-end gap-3"
              onSubmit={exception.handleSubmit((v) => pay.mutate({ exception: true, reason: v.reason }, { onSuccess: () => setShowException(false) }))}
            >
              <TextField label={t('gates.exceptionWhy')} {...exception.register('reason')} error={exception.formState.errors.reason?.message} />
              <Button type="submit" variant="secondary" disabled={pay.isPending}>
                {t('gates.recordException')}
              </Button>
            </form>
          ) : (
            <Button variant="ghost" onClick={() => setShowException(true)}>
              {t('gates.allowUnpaid')}
            </Button>
          )}
        </div>
      )}
      {pay.error && <ErrorPanel title={t('gates.notRecorded')} message={errorText(pay.error)} />}
    </Gate>
  );
}

function ProofGate({ order }: { order: OrderDetail }) {
  const { t } = useTranslation('orders');
  const upload = useUploadProof(order.id);
  const approve = useApproveProof(order.id);
  const fileInput = useRef<HTMLInputElement>(null);
  // the factory's today: before 08:00 in Shanghai the UTC date is still yesterday
  const [approvedOn, setApprovedOn] = useState(() => factoryTodayDate());
  const latest = order.proofs.at(-1);
  const ok = !order.openGates.includes('proof_not_approved');
  const released = order.releasedAt != null;
  return (
    <Gate ok={ok || released} title={t('gates.proof')}>
      {order.proofs.length === 0 ? (
        <p className="text-harbour-700">{t('gates.noProof')}</p>
      ) : (
        <ul className="flex flex-col gap-2">
          {order.proofs.map((p) => (
            <li key={p.revision} className="flex flex-wrap items-center gap-2">
              <FileText className="h-5 w-5 text-harbour-700" aria-hidden />
              <a className="font-bold text-harbour-800 underline" href={proofFileUrl(order.id, p.revision)} target="_blank" rel="noreferrer">
                {t('gates.revision', { n: p.revision })}
              </a>
              <span className="text-sm text-harbour-700">
                {t('gates.uploaded', { file: p.originalName, kb: (p.sizeBytes / 1024).toFixed(0), at: formatDateTime(p.uploadedAt), name: p.uploadedBy })}
              </span>
              {p.approvedAt ? (
                <Pill tone="ok">
                  {p.approvedBy
                    ? t('gates.approvedBy', { date: formatDate(p.approvedAt), name: p.approvedBy })
                    : t('gates.approved', { date: formatDate(p.approvedAt) })}
                  {p.approvalNote ? ` · ${p.approvalNote}` : ''}
                </Pill>
              ) : p.changesRequestedAt ? (
                <p role="status" className="w-full rounded bg-warn-50 p-2 text-ink">
                  <Trans
                    t={t}
                    i18nKey="gates.changesAsked"
                    values={{ at: formatDateTime(p.changesRequestedAt), comment: p.changesComment ?? '' }}
                    components={{ strong: <strong /> }}
                  />
                </p>
              ) : p.revision === latest?.revision ? (
                <Pill tone="warn">{t('gates.waiting')}</Pill>
              ) : (
                <Pill>{t('gates.replaced')}</Pill>
              )}
            </li>
          ))}
        </ul>
      )}
      {!released && latest && !latest.approvedAt && (
        <form
          aria-label={t('gates.approvalForm')}
          className="flex flex-wrap items-end gap-3"
          onSubmit={(ev) => {
            ev.preventDefault();
            approve.mutate({ revision: latest.revision, body: { approvedOn } });
          }}
        >
          <TextField label={t('gates.approvedOn')} type="date" value={approvedOn} max={factoryTodayDate()} onChange={(ev) => setApprovedOn(ev.target.value)} />
          <Button type="submit" disabled={approve.isPending}>
            {t('gates.approve', { n: latest.revision })}
          </Button>
        </form>
      )}
      {!released && (
        <div className="flex flex-wrap items-end gap-3">
          <label className="flex flex-col gap-1 text-sm font-bold">
            {t('gates.proofFile')}
            <input
              ref={fileInput}
              type="file"
              accept="application/pdf,image/png,image/jpeg"
              className="min-h-11 rounded-lg border-2 border-harbour-100 bg-white p-2 font-normal"
              onChange={(ev) => {
                const f = ev.target.files?.[0];
                if (f) upload.mutate(f, { onSettled: () => fileInput.current && (fileInput.current.value = '') });
              }}
            />
          </label>
          {upload.isPending && (
            <span role="status" className="flex items-center gap-2">
              <Upload className="h-5 w-5" aria-hidden /> {t('gates.uploading')}
            </span>
          )}
        </div>
      )}
      {upload.error && <ErrorPanel title={t('gates.notUploaded')} message={errorText(upload.error)} />}
      {approve.error && <ErrorPanel title={t('gates.approvalNotRecorded')} message={errorText(approve.error)} />}
    </Gate>
  );
}

/** The two gates before release: payment (or a manager's exception) and the approved proof. */
export function GatesPanel({ order, role }: { order: OrderDetail; role: Role }) {
  const { t } = useTranslation('orders');
  return (
    <Card>
      <h2 className="mb-4 text-xl font-bold text-harbour-900">{t('gates.title')}</h2>
      <div className="grid gap-8 lg:grid-cols-2">
        <PaymentGate order={order} role={role} />
        <ProofGate order={order} />
      </div>
    </Card>
  );
}
