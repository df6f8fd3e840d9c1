import { useRef, useState, type ReactNode } from 'react';
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
import { proofFileUrl, useApproveProof, useRecordPayment, useUploadProof } from '../api/gates';

const paymentForm = z.object({
  amount: z.number({ error: 'Enter the amount' }).positive('Amount must be above 0'),
  reference: z.string().trim().min(1, 'Give the payment reference'),
});
const exceptionForm = z.object({ reason: z.string().trim().min(5, 'Say why production may start unpaid') });

function Gate({ ok, title, children }: { ok: boolean; title: string; children: ReactNode }) {
  return (
    <section aria-label={title} className="flex flex-col gap-3">
      <h3 className="flex items-center gap-2 text-lg font-bold text-harbour-900">
        {ok ? <CheckCircle2 className="h-6 w-6 text-ok-700" aria-hidden /> : <CircleDashed className="h-6 w-6 text-warn-700" aria-hidden />}
        {title}
        {ok ? <Pill tone="ok">Done</Pill> : <Pill tone="warn">Open</Pill>}
      </h3>
      {children}
    </section>
  );
}

function PaymentGate({ order, role }: { order: OrderDetail; role: Role }) {
  const pay = useRecordPayment(order.id);
  const form = useForm<z.infer<typeof paymentForm>>({ resolver: zodResolver(paymentForm) });
  const exception = useForm<z.infer<typeof exceptionForm>>({ resolver: zodResolver(exceptionForm) });
  const [showException, setShowException] = useState(false);
  const mayExcept = role === 'manager' || role === 'admin';
  const ok = !order.openGates.includes('payment_missing');
  return (
    <Gate ok={ok || order.releasedAt != null} title="Payment">
      {order.payment.required != null && (
        <p data-testid="payment-due">
          Price {order.payment.priceTotal?.toFixed(2)} {order.payment.currency} · due before release ({order.payment.depositPct} %){' '}
          {order.payment.required.toFixed(2)} · paid {order.paidTotal.toFixed(2)} · <strong>still due {(order.payment.amountDue ?? 0).toFixed(2)}</strong>
        </p>
      )}
      {order.payments.length > 0 && (
        <ul className="flex flex-col gap-1">
          {order.payments.map((p) => (
            <li key={p.id}>
              {p.isException ? (
                <>
                  <strong>Exception</strong> by {p.recordedBy}: {p.note}
                </>
              ) : (
                <>
                  <strong>
                    {p.amount?.toFixed(2)} {p.currency ?? ''}
                  </strong>{' '}
                  · {p.source === 'checkout' ? 'paid online' : `by ${p.recordedBy}`} · {p.reference} {p.note && `· ${p.note}`}
                </>
              )}{' '}
              <span className="text-sm text-harbour-700">({formatDateTime(p.recordedAt)})</span>
            </li>
          ))}
        </ul>
      )}
      <form
        noValidate
        aria-label="Record a payment"
        className="flex flex-wrap items-end gap-3"
        onSubmit={form.handleSubmit((v) => pay.mutate(v, { onSuccess: () => form.reset() }))}
      >
        <TextField
          label="Amount"
          type="number"
          step="0.01"
          inputMode="decimal"
          {...form.register('amount', { valueAsNumber: true })}
          error={form.formState.errors.amount?.message}
        />
        <TextField label="Payment reference" {...form.register('reference')} error={form.formState.errors.reference?.message} />
        <Button type="submit" disabled={pay.isPending}>
          Record payment
        </Button>
      </form>
      {mayExcept && !ok && (
        <div>
          {showException ? (
            <form
              noValidate
              aria-label="Allow without payment"
              className="flex flex-wrap items-end gap-3"
              onSubmit={exception.handleSubmit((v) => pay.mutate({ exception: true, reason: v.reason }, { onSuccess: () => setShowException(false) }))}
            >
              <TextField label="Why may it start unpaid?" {...exception.register('reason')} error={exception.formState.errors.reason?.message} />
              <Button type="submit" variant="secondary" disabled={pay.isPending}>
                Record exception
              </Button>
            </form>
          ) : (
            <Button variant="ghost" onClick={() => setShowException(true)}>
              Allow release without payment (manager)
            </Button>
          )}
        </div>
      )}
      {pay.error && <ErrorPanel title="Not recorded" message={pay.error.message} />}
    </Gate>
  );
}

function ProofGate({ order }: { order: OrderDetail }) {
  const upload = useUploadProof(order.id);
  const approve = useApproveProof(order.id);
  const fileInput = useRef<HTMLInputElement>(null);
  // the factory's today: before 08:00 in Shanghai the UTC date is still yesterday
  const [approvedOn, setApprovedOn] = useState(() => factoryTodayDate());
  const latest = order.proofs.at(-1);
  const ok = !order.openGates.includes('proof_not_approved');
  const released = order.releasedAt != null;
  return (
    <Gate ok={ok || released} title="Artwork proof">
      {order.proofs.length === 0 ? (
        <p className="text-harbour-700">No proof uploaded yet.</p>
      ) : (
        <ul className="flex flex-col gap-2">
          {order.proofs.map((p) => (
            <li key={p.revision} className="flex flex-wrap items-center gap-2">
              <FileText className="h-5 w-5 text-harbour-700" aria-hidden />
              <a className="font-bold text-harbour-800 underline" href={proofFileUrl(order.id, p.revision)} target="_blank" rel="noreferrer">
                Revision {p.revision}
              </a>
              <span className="text-sm text-harbour-700">
                {p.originalName} · {(p.sizeBytes / 1024).toFixed(0)} KB · uploaded {formatDateTime(p.uploadedAt)} by {p.uploadedBy}
              </span>
              {p.approvedAt ? (
                <Pill tone="ok">
                  Approved {formatDate(p.approvedAt)}
                  {p.approvedBy ? ` by ${p.approvedBy}` : ''}
                  {p.approvalNote ? ` · ${p.approvalNote}` : ''}
                </Pill>
              ) : p.changesRequestedAt ? (
                <p role="status" className="w-full rounded bg-warn-50 p-2 text-ink">
                  <strong>Changes asked for</strong> on the order page ({formatDateTime(p.changesRequestedAt)}): “{p.changesComment}”. Upload a new revision for
                  the customer to approve.
                </p>
              ) : p.revision === latest?.revision ? (
                <Pill tone="warn">Waiting for the customer</Pill>
              ) : (
                <Pill>Replaced</Pill>
              )}
            </li>
          ))}
        </ul>
      )}
      {!released && latest && !latest.approvedAt && (
        <form
          aria-label="Record the customer's approval"
          className="flex flex-wrap items-end gap-3"
          onSubmit={(ev) => {
            ev.preventDefault();
            approve.mutate({ revision: latest.revision, body: { approvedOn } });
          }}
        >
          <TextField
            label="Approved by the customer on"
            type="date"
            value={approvedOn}
            max={factoryTodayDate()}
            onChange={(ev) => setApprovedOn(ev.target.value)}
          />
          <Button type="submit" disabled={approve.isPending}>
            Approve revision {latest.revision}
          </Button>
        </form>
      )}
      {!released && (
        <div className="flex flex-wrap items-end gap-3">
          <label className="flex flex-col gap-1 text-sm font-bold">
            Proof file (PDF, PNG or JPEG, up to 20 MB)
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
              <Upload className="h-5 w-5" aria-hidden /> Uploading…
            </span>
          )}
        </div>
      )}
      {upload.error && <ErrorPanel title="Proof not uploaded" message={upload.error.message} />}
      {approve.error && <ErrorPanel title="Approval not recorded" message={approve.error.message} />}
    </Gate>
  );
}

/** The two gates before release: payment (or a manager's exception) and the approved proof. */
export function GatesPanel({ order, role }: { order: OrderDetail; role: Role }) {
  return (
    <Card>
      <h2 className="mb-4 text-xl font-bold text-harbour-900">Before release</h2>
      <div className="grid gap-8 lg:grid-cols-2">
        <PaymentGate order={order} role={role} />
        <ProofGate order={order} />
      </div>
    </Card>
  );
}
