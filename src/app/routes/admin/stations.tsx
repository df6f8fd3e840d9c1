import { useState } from 'react';
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
  const save = useSaveStation();
  const form = useForm({
    resolver: zodResolver(stationBody),
    defaultValues: station ?? { code: '', name: '', nameZh: '', kind: 'fill', capacityTrays: 1, continuous: false, instructions: '', safetyNotes: '', instructionsZh: '', safetyNotesZh: '', active: true },
  });
  const e = form.formState.errors;
  return (
    <form
      noValidate
      className="grid gap-4 md:grid-cols-4"
      onSubmit={form.handleSubmit((body) => save.mutate({ id: station?.id, body: body as StationBody }, { onSuccess: onDone }))}
    >
      <TextField label="Code" {...form.register('code')} error={e.code?.message} hint="e.g. FIL-3" />
      <TextField label="Name" {...form.register('name')} error={e.name?.message} />
      <SelectField label="Kind of work" {...form.register('kind')} error={e.kind?.message}>
        {STATION_KINDS.map((k) => (
          <option key={k} value={k}>
            {k.replace('_', ' ')}
          </option>
        ))}
      </SelectField>
      <TextField label="Trays at once" type="number" min={1} {...form.register('capacityTrays', { valueAsNumber: true })} error={e.capacityTrays?.message} />
      <TextField label="Name in Chinese" lang="zh-CN" {...form.register('nameZh')} error={e.nameZh?.message} hint="Shown on Chinese screens; empty shows the name above." />
      <div className="md:col-span-2">
        <TextAreaField label="Instructions shown on the tablet" rows={3} {...form.register('instructions')} />
      </div>
      <div className="md:col-span-2">
        <TextAreaField label="Safety notes shown on the tablet" rows={3} {...form.register('safetyNotes')} hint="Keep the line that local regulations and the factory’s procedures take precedence." />
      </div>
      <div className="md:col-span-2">
        <TextAreaField label="Instructions in Chinese" lang="zh-CN" rows={3} {...form.register('instructionsZh')} error={e.instructionsZh?.message} />
      </div>
      <div className="md:col-span-2">
        <TextAreaField label="Safety notes in Chinese" lang="zh-CN" rows={3} {...form.register('safetyNotesZh')} error={e.safetyNotesZh?.message} hint="Keep the line that local regulations and the factory’s procedures take precedence." />
      </div>
      <CheckboxField label="Works outside shifts (ovens keep curing)" {...form.register('continuous')} />
      <CheckboxField label="In use" {...form.register('active')} />
      {save.error && (
        <div className="md:col-span-4">
          <ErrorPanel title="Not saved" message={save.error.message} />
        </div>
      )}
      <div className="flex gap-2 md:col-span-4">
        <Button type="submit" disabled={save.isPending}>
          {station ? 'Save station' : 'Add station'}
        </Button>
        <Button variant="ghost" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

const col = createColumnHelper<StationView>();

export function Component() {
  const stations = useStations();
  const [editing, setEditing] = useState<StationView | 'new' | null>(null);
  const columns = [
    col.accessor('code', { header: 'Code' }),
    col.accessor('name', { header: 'Name' }),
    col.accessor('kind', { header: 'Kind', cell: (c) => c.getValue().replace('_', ' ') }),
    col.accessor('capacityTrays', { header: 'Trays at once' }),
    col.accessor('continuous', { header: 'Hours', cell: (c) => (c.getValue() ? 'Round the clock' : 'Shifts') }),
    col.accessor('active', { header: 'State', cell: (c) => (c.getValue() ? <Pill tone="ok">In use</Pill> : <Pill>Not in use</Pill>) }),
    col.display({ id: 'edit', header: '', cell: (c) => <Button variant="ghost" onClick={() => setEditing(c.row.original)}>Edit</Button> }),
  ];
  return (
    <>
      <PageHeader title="Stations" subtitle="Where the work happens. A routing step names a kind of work; any station of that kind can do it." actions={<Button onClick={() => setEditing('new')}>Add a station</Button>} />
      {editing && (
        <Card className="mb-6">
          <StationForm key={editing === 'new' ? 'new' : editing.id} station={editing === 'new' ? undefined : editing} onDone={() => setEditing(null)} />
        </Card>
      )}
      {stations.isPending ? <Loading /> : stations.error ? <ErrorPanel message={stations.error.message} /> : <DataTable data={stations.data} columns={columns} filterLabel="Find a station" caption="Stations" />}
    </>
  );
}
