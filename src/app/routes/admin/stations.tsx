import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { createColumnHelper } from '@tanstack/react-table';
import { stationBody, type StationBody, type StationView } from '@shared/schemas/stations';
import { STATION_KINDS } from '@shared/domain/vocabulary';
import { ADMIN_ONLY } from '@shared/domain/access';
import { queryClient } from '@/lib/query-client';
import { stationsQueryOptions, useSaveStation, useStations } from '@/features/stations/api/get-stations';
import { DataTable } from '@/components/ui/data-table';
import { Card, ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';
import { Button } from '@/components/ui/button';
import { CheckboxField, SelectField, TextAreaField, TextField } from '@/components/ui/field';

export const handle = { roles: ADMIN_ONLY };
export const loader = () => queryClient.ensureQueryData(stationsQueryOptions());

function StationForm({ station, onDone }: { station?: StationView; onDone: () => void }) {
  const { t } = useTranslation(['admin', 'common']);
  const save = useSaveStation();
  const form = useForm({
    resolver: zodResolver(stationBody),
    defaultValues: station ?? {
      code: '',
      name: '',
      nameZh: '',
      kind: 'fill',
      capacityTrays: 1,
      continuous: false,
      instructions: '',
      safetyNotes: '',
      instructionsZh: '',
      safetyNotesZh: '',
      active: true,
    },
  });
  const e = form.formState.errors;
  return (
    <form
      noValidate
      className="grid gap-4 md:grid-cols-4"
      onSubmit={form.handleSubmit((body) => save.mutate({ id: station?.id, body: body as StationBody }, { onSuccess: onDone }))}
    >
      <TextField label={t('code')} {...form.register('code')} error={e.code?.message} hint={t('stations.codeHint', { example: 'FIL-3' })} />
      <TextField label={t('name')} {...form.register('name')} error={e.name?.message} />
      <SelectField label={t('stations.kindOfWork')} {...form.register('kind')} error={e.kind?.message}>
        {STATION_KINDS.map((k) => (
          <option key={k} value={k}>
            {t(`common:kind.${k}`)}
          </option>
        ))}
      </SelectField>
      <TextField
        label={t('stations.capacity')}
        type="number"
        min={1}
        {...form.register('capacityTrays', { valueAsNumber: true })}
        error={e.capacityTrays?.message}
      />
      <TextField label={t('stations.nameZh')} lang="zh-CN" {...form.register('nameZh')} error={e.nameZh?.message} hint={t('stations.nameZhHint')} />
      <div className="md:col-span-2">
        <TextAreaField label={t('stations.instructions')} rows={3} {...form.register('instructions')} />
      </div>
      <div className="md:col-span-2">
        <TextAreaField label={t('stations.safetyNotes')} rows={3} {...form.register('safetyNotes')} hint={t('stations.safetyHint')} />
      </div>
      <div className="md:col-span-2">
        <TextAreaField label={t('stations.instructionsZh')} lang="zh-CN" rows={3} {...form.register('instructionsZh')} error={e.instructionsZh?.message} />
      </div>
      <div className="md:col-span-2">
        <TextAreaField
          label={t('stations.safetyNotesZh')}
          lang="zh-CN"
          rows={3}
          {...form.register('safetyNotesZh')}
          error={e.safetyNotesZh?.message}
          hint={t('stations.safetyHint')}
        />
      </div>
      <CheckboxField label={t('stations.continuous')} {...form.register('continuous')} />
      <CheckboxField label={t('stations.inUse')} {...form.register('active')} />
      {save.error && (
        <div className="md:col-span-4">
          <ErrorPanel title={t('notSaved')} message={save.error.message} />
        </div>
      )}
      <div className="flex gap-2 md:col-span-4">
        <Button type="submit" disabled={save.isPending}>
          {station ? t('stations.save') : t('stations.create')}
        </Button>
        <Button variant="ghost" onClick={onDone}>
          {t('cancel')}
        </Button>
      </div>
    </form>
  );
}

const col = createColumnHelper<StationView>();

export function Component() {
  const { t } = useTranslation(['admin', 'common']);
  const stations = useStations();
  const [editing, setEditing] = useState<StationView | 'new' | null>(null);
  const columns = [
    col.accessor('code', { header: t('code') }),
    col.accessor('name', { header: t('name') }),
    col.accessor('kind', { header: t('stations.kind'), cell: (c) => t(`common:kind.${c.getValue()}`) }),
    col.accessor('capacityTrays', { header: t('stations.capacity') }),
    col.accessor('continuous', { header: t('stations.hours'), cell: (c) => (c.getValue() ? t('stations.roundTheClock') : t('stations.shifts')) }),
    col.accessor('active', {
      header: t('state'),
      cell: (c) => (c.getValue() ? <Pill tone="ok">{t('stations.inUse')}</Pill> : <Pill>{t('stations.notInUse')}</Pill>),
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
      <PageHeader
        title={t('stations.title')}
        subtitle={t('stations.subtitle')}
        actions={<Button onClick={() => setEditing('new')}>{t('stations.add')}</Button>}
      />
      {editing && (
        <Card className="mb-6">
          <StationForm key={editing === 'new' ? 'new' : editing.id} station={editing === 'new' ? undefined : editing} onDone={() => setEditing(null)} />
        </Card>
      )}
      {stations.isPending ? (
        <Loading />
      ) : stations.error ? (
        <ErrorPanel message={stations.error.message} />
      ) : (
        <DataTable data={stations.data} columns={columns} filterLabel={t('stations.find')} caption={t('stations.caption')} />
      )}
    </>
  );
}
