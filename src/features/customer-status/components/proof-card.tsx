import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useTranslation } from 'react-i18next';
import { CheckCircle2, FileText } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { TextAreaField, TextField } from '@/components/ui/field';
import { portalApproveBodySchema, portalChangesBodySchema, type PortalApproveBody, type PortalChangesBody } from '@shared/schemas/payments';
import type { PublicOrder } from '@shared/schemas/shipping';
import { useApproveProof, useAskForChanges } from '../api/portal-actions';

type Proof = PublicOrder['proofs'][number];

function ErrorLine({ error }: { error: Error | null }) {
  if (!error) return null;
  return (
    <p role="alert" className="text-sm font-bold text-stop-700">
      {error.message}
    </p>
  );
}

/** One proof revision: its picture, and for the latest one still open, approve or ask for changes. */
export function ProofCard({ token, proof, canAnswer, day }: { token: string; proof: Proof; canAnswer: boolean; day: (iso: string) => string }) {
  const { t } = useTranslation('portal');
  const approve = useApproveProof(token);
  const changes = useAskForChanges(token);
  const [mode, setMode] = useState<'approve' | 'changes'>('approve');
  const approveForm = useForm<PortalApproveBody>({ resolver: zodResolver(portalApproveBodySchema), defaultValues: { name: '' } });
  const changesForm = useForm<PortalChangesBody>({ resolver: zodResolver(portalChangesBodySchema), defaultValues: { comment: '' } });
  const open = proof.latest && !proof.approvedAt && canAnswer;

  return (
    <article aria-label={t('proofs.revision', { revision: proof.revision })} className="flex flex-col gap-3 rounded-lg border border-harbour-100 p-3">
      <h3 className="text-lg font-bold text-harbour-900">{t('proofs.revision', { revision: proof.revision })}</h3>
      {proof.thumbnailUrl && (
        <img
          src={proof.thumbnailUrl}
          alt={t('proofs.thumbAlt', { revision: proof.revision })}
          className="max-h-72 w-full rounded border border-harbour-100 bg-white object-contain"
        />
      )}
      <a href={proof.fileUrl} target="_blank" rel="noreferrer" className="inline-flex min-h-11 items-center gap-2 font-bold text-harbour-800 underline">
        <FileText className="h-5 w-5" aria-hidden /> {t('proofs.open', { revision: proof.revision })}
      </a>
      {proof.approvedAt && (
        <p className="flex items-center gap-2 font-bold text-ok-700">
          <CheckCircle2 className="h-5 w-5" aria-hidden />
          {proof.approvedByName
            ? t('proofs.approvedBy', { name: proof.approvedByName, date: day(proof.approvedAt) })
            : t('proofs.approvedOn', { date: day(proof.approvedAt) })}
        </p>
      )}
      {!proof.latest && !proof.approvedAt && <p className="text-harbour-700">{t('proofs.replaced')}</p>}
      {proof.changesRequestedAt && !proof.approvedAt && (
        <p className="rounded bg-warn-50 p-2 text-ink">
          {t('proofs.changesSent', { date: day(proof.changesRequestedAt), comment: proof.changesComment ?? '' })}
        </p>
      )}
      {open && (
        <div className="flex flex-col gap-3">
          <p className="text-ink">{t('proofs.checkIt')}</p>
          <div role="group" className="grid grid-cols-2 gap-2">
            <Button variant={mode === 'approve' ? 'primary' : 'secondary'} aria-pressed={mode === 'approve'} onClick={() => setMode('approve')}>
              {t('proofs.approve')}
            </Button>
            <Button variant={mode === 'changes' ? 'primary' : 'secondary'} aria-pressed={mode === 'changes'} onClick={() => setMode('changes')}>
              {t('proofs.askChanges')}
            </Button>
          </div>
          {mode === 'approve' ? (
            <form noValidate className="flex flex-col gap-3" onSubmit={approveForm.handleSubmit((body) => approve.mutate({ revision: proof.revision, body }))}>
              <TextField
                label={t('proofs.nameLabel')}
                autoComplete="name"
                {...approveForm.register('name')}
                error={approveForm.formState.errors.name ? t('proofs.nameError') : undefined}
              />
              <Button type="submit" size="lg" disabled={approve.isPending}>
                {approve.isPending ? t('proofs.approving') : t('proofs.approve')}
              </Button>
              <ErrorLine error={approve.error} />
            </form>
          ) : (
            <form noValidate className="flex flex-col gap-3" onSubmit={changesForm.handleSubmit((body) => changes.mutate({ revision: proof.revision, body }))}>
              <TextAreaField
                label={t('proofs.changesLabel')}
                rows={4}
                {...changesForm.register('comment')}
                error={changesForm.formState.errors.comment ? t('proofs.changesError') : undefined}
              />
              <Button type="submit" size="lg" disabled={changes.isPending}>
                {changes.isPending ? t('proofs.sending') : t('proofs.askChanges')}
              </Button>
              <ErrorLine error={changes.error} />
            </form>
          )}
        </div>
      )}
      {(approve.isSuccess || changes.isSuccess) && (
        <p role="status" className="font-bold text-ok-700">
          {t('proofs.done')}
        </p>
      )}
    </article>
  );
}
