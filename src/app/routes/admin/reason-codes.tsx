import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { createColumnHelper } from '@tanstack/react-table';
import { reasonCodeBody, type ReasonCodeAdminView, type ReasonCodeBody } from '@shared/schemas/admin';
import { STATION_KINDS } from '@shared/domain/vocabulary';
import { ADMIN_ONLY } from '@shared/domain/access';
import { queryClient } from '@/lib/query-client';
import { reasonCodesAdminQueryOptions, useReasonCodesAdmin, useSaveReasonCode } from '@/features/admin/api/reason-codes';
import { DataTable } from '@/components/ui/data-table';
import { Card, ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';
import { Button } from '@/components/ui/button';
import { CheckboxField, SelectField, TextField } from '@/components/ui/field';

export const handle = { roles: ADMIN_ONLY };
export const loader = () => queryClient.ensureQueryData(reasonCodesAdminQueryOptions());

function ReasonForm({ existing, onDone }: { existing?: ReasonCodeAdminView; onDone: () => void }) {
  const { t } = useTranslation(['admin', 'common']);
  const save = useSaveReasonCode();
  const form = useForm({
    resolver: zodResolver(reasonCodeBody),
    defaultValues: existing ?? { code: '', name: '', nameZh: '', kind: 'scrap', stationKind: null, active: true },
  });
  const e = form.formState.errors;
  return (
    <form
      noValidate
      className="grid gap-4 md:grid-cols-3"
      onSubmit={form.handleSubmit((v) => {
        const body = v as ReasonCodeBody;
        const { code: _code, ...patch } = body;
        save.mutate(existing ? { existing: existing.code, body: patch } : { body }, { onSuccess: onDone });
      })}
    >
      <TextField label={t('code')} disabled={!!existing} {...form.register('code')} error={e.code?.message} hint={t('reasons.codeHint')} />
      <TextField label={t('reasons.nameEn')} {...form.register('name')} error={e.name?.message} />
      <TextField label={t('reasons.nameZh')} lang="zh-CN" {...form.register('nameZh')} error={e.nameZh?.message} />
      <SelectField label={t('reasons.usedFor')} {...form.register('kind')}>
        <option value="scrap">{t('reasons.kind.scrap')}</option>
        <option value="rework">{t('reasons.kind.rework')}</option>
        <option value="hold">{t('reasons.kind.hold')}</option>
      </SelectField>
      <SelectField label={t('reasons.onlyKind')} {...form.register('stationKind', { setValueAs: (v) => (v ? v : null) })}>
        <option value="">{t('reasons.anyStation')}</option>
        {STATION_KINDS.map((k) => (
          <option key={k} value={k}>
            {t(`common:kind.${k}`)}
          </option>
        ))}
      </SelectField>
      <CheckboxField label={t('reasons.offeredOnTablets')} {...form.register('active')} />
      {save.error && (
        <div className="md:col-span-3">
          <ErrorPanel title={t('notSaved')} message={save.error.message} />
        </div>
      )}
      <div className="flex gap-2 md:col-span-3">
        <Button type="submit">{existing ? t('reasons.save') : t('reasons.create')}</Button>
        <Button variant="ghost" onClick={onDone}>
          {t('cancel')}
        </Button>
      </div>
    </form>
  );
}

const col = createColumnHelper<ReasonCodeAdminView>();

export function Component() {
  const { t } = useTranslation(['admin', 'common']);
  const codes = useReasonCodesAdmin();
  const [editing, setEditing] = useState<ReasonCodeAdminView | 'new' | null>(null);
  const columns = [
    col.accessor('code', { header: t('code') }),
    col.accessor('name', { header: t('name') }),
    col.accessor('nameZh', { header: t('reasons.nameZhCol'), cell: (c) => <span lang="zh-CN">{c.getValue()}</span> }),
    col.accessor('kind', { header: t('reasons.usedFor'), cell: (c) => t(`reasons.kind.${c.getValue()}`) }),
    col.accessor('stationKind', {
      header: t('reasons.stationKind'),
      cell: (c) => {
        const k = c.getValue();
        return k ? t(`common:kind.${k}`) : t('reasons.any');
      },
    }),
    col.accessor('active', {
      header: t('state'),
      cell: (c) => (c.getValue() ? <Pill tone="ok">{t('reasons.offered')}</Pill> : <Pill>{t('reasons.switchedOff')}</Pill>),
    }),
    col.display({
      id: 'edit',
      header: '',
      cell: (c) => (
        <Button variant="ghost" onClick={() => setEditing(c.row.original)}>
          {t('edit')}
        </Button>
      ),
    }),
  ];
  return (
    <>
      <PageHeader title={t('reasons.title')} subtitle={t('reasons.subtitle')} actions={<Button onClick={() => setEditing('new')}>{t('reasons.add')}</Button>} />
      {editing && (
        <Card className="mb-6">
          <ReasonForm key={editing === 'new' ? 'new' : editing.code} existing={editing === 'new' ? undefined : editing} onDone={() => setEditing(null)} />
        </Card>
      )}
      {codes.isPending ? (
        <Loading />
      ) : codes.error ? (
        <ErrorPanel message={codes.error.message} />
      ) : (
        <DataTable data={codes.data} columns={columns} filterLabel={t('reasons.find')} caption={t('reasons.caption')} />
      )}
    </>
  );
}
