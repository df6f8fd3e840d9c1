import { useState } from 'react';
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

const KIND_LABEL = { scrap: 'Scrap', rework: 'Rework', hold: 'Hold' } as const;

function ReasonForm({ existing, onDone }: { existing?: ReasonCodeAdminView; onDone: () => void }) {
  const save = useSaveReasonCode();
  const form = useForm({ resolver: zodResolver(reasonCodeBody), defaultValues: existing ?? { code: '', name: '', nameZh: '', kind: 'scrap', stationKind: null, active: true } });
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
      <TextField label="Code" disabled={!!existing} {...form.register('code')} error={e.code?.message} hint="Stored with every scan; cannot change later." />
      <TextField label="Name (English)" {...form.register('name')} error={e.name?.message} />
      <TextField label="Name (简体中文)" lang="zh-CN" {...form.register('nameZh')} error={e.nameZh?.message} />
      <SelectField label="Used for" {...form.register('kind')}>
        <option value="scrap">Scrap</option>
        <option value="rework">Rework</option>
        <option value="hold">Hold</option>
      </SelectField>
      <SelectField label="Only at stations of kind" {...form.register('stationKind', { setValueAs: (v) => (v ? v : null) })}>
        <option value="">Any station</option>
        {STATION_KINDS.map((k) => (
          <option key={k} value={k}>
            {k.replace('_', ' ')}
          </option>
        ))}
      </SelectField>
      <CheckboxField label="Offered on the tablets" {...form.register('active')} />
      {save.error && (
        <div className="md:col-span-3">
          <ErrorPanel title="Not saved" message={save.error.message} />
        </div>
      )}
      <div className="flex gap-2 md:col-span-3">
        <Button type="submit">{existing ? 'Save reason' : 'Add reason'}</Button>
        <Button variant="ghost" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

const col = createColumnHelper<ReasonCodeAdminView>();

export function Component() {
  const codes = useReasonCodesAdmin();
  const [editing, setEditing] = useState<ReasonCodeAdminView | 'new' | null>(null);
  const columns = [
    col.accessor('code', { header: 'Code' }),
    col.accessor('name', { header: 'Name' }),
    col.accessor('nameZh', { header: '中文', cell: (c) => <span lang="zh-CN">{c.getValue()}</span> }),
    col.accessor('kind', { header: 'Used for', cell: (c) => KIND_LABEL[c.getValue()] }),
    col.accessor('stationKind', { header: 'Station kind', cell: (c) => c.getValue()?.replace('_', ' ') ?? 'any' }),
    col.accessor('active', { header: 'State', cell: (c) => (c.getValue() ? <Pill tone="ok">Offered</Pill> : <Pill>Switched off</Pill>) }),
    col.display({ id: 'edit', header: '', cell: (c) => <Button variant="ghost" onClick={() => setEditing(c.row.original)}>Edit</Button> }),
  ];
  return (
    <>
      <PageHeader
        title="Reason codes"
        subtitle="The reasons operators pick for scrap, rework and holds, in English and Chinese. Codes are never deleted, only switched off, so history keeps its meaning."
        actions={<Button onClick={() => setEditing('new')}>Add a reason</Button>}
      />
      {editing && (
        <Card className="mb-6">
          <ReasonForm key={editing === 'new' ? 'new' : editing.code} existing={editing === 'new' ? undefined : editing} onDone={() => setEditing(null)} />
        </Card>
      )}
      {codes.isPending ? <Loading /> : codes.error ? <ErrorPanel message={codes.error.message} /> : <DataTable data={codes.data} columns={columns} filterLabel="Find a reason" caption="Reason codes" />}
    </>
  );
}
