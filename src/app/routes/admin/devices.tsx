import { useState } from 'react';
import { Trans, useTranslation } from 'react-i18next';
import { createColumnHelper } from '@tanstack/react-table';
import type { DeviceView } from '@shared/schemas/stations';
import { ADMIN_ONLY } from '@shared/domain/access';
import { queryClient } from '@/lib/query-client';
import { devicesQueryOptions, useCreateDevice, useDevices, useNewPairingCode, useUpdateDevice, type NewDevice } from '@/features/devices/api/get-devices';
import { stationsQueryOptions, useStations } from '@/features/stations/api/get-stations';
import { DataTable } from '@/components/ui/data-table';
import { Card, ErrorPanel, Loading, PageHeader, Pill } from '@/components/ui/panels';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { paths } from '@/config/paths';
import { formatDateTime } from '@/lib/datetime';

export const handle = { roles: ADMIN_ONLY };
export const loader = () => Promise.all([queryClient.ensureQueryData(devicesQueryOptions()), queryClient.ensureQueryData(stationsQueryOptions())]);

function PairingNotice({ device }: { device: NewDevice }) {
  const { t } = useTranslation('admin');
  return (
    <div role="status" className="rounded-xl border-2 border-brass-400 bg-white p-5">
      <p className="font-bold">{t('devices.pairingCode')}</p>
      <p className="my-2 font-mono text-5xl font-bold tracking-[0.3em] text-harbour-900" data-testid="pairing-code">
        {device.pairingCode}
      </p>
      <p className="text-harbour-700">
        <Trans t={t} i18nKey="devices.pairingHow" values={{ url: window.location.origin + paths.pair }} components={{ strong: <strong /> }} />
      </p>
    </div>
  );
}

export function Component() {
  const { t } = useTranslation('admin');
  const devices = useDevices();
  const stations = useStations();
  const create = useCreateDevice();
  const update = useUpdateDevice();
  const repair = useNewPairingCode();
  const [name, setName] = useState('');
  const [stationId, setStationId] = useState('');
  const [locale, setLocale] = useState<'en' | 'zh-CN'>('en');
  const [fresh, setFresh] = useState<NewDevice | null>(null);
  const stationName = (id: string | null) => (id ? (stations.data?.find((s) => s.id === id)?.name ?? '—') : t('devices.wallDisplay'));

  const col = createColumnHelper<DeviceView>();
  const columns = [
    col.accessor('name', { header: t('name') }),
    col.accessor('stationId', { header: t('devices.station'), cell: (c) => stationName(c.getValue()) }),
    col.accessor('locale', { header: t('devices.language'), cell: (c) => (c.getValue() === 'zh-CN' ? '简体中文' : 'English') }),
    col.accessor('idleMinutes', { header: t('devices.idle') }),
    col.accessor('paired', {
      header: t('devices.paired'),
      cell: (c) =>
        c.getValue() ? <Pill tone="ok">{t('devices.paired')}</Pill> : <Pill tone="warn">{t('devices.waiting', { code: c.row.original.pairingCode })}</Pill>,
    }),
    col.accessor('lastSeenAt', { header: t('devices.lastSeen'), cell: (c) => formatDateTime(c.getValue()) }),
    col.display({
      id: 'actions',
      header: t('devices.actions'),
      cell: (c) => (
        <div className="flex gap-2">
          <Button variant="secondary" onClick={() => repair.mutate(c.row.original.id, { onSuccess: setFresh })}>
            {t('devices.newCode')}
          </Button>
          <Button variant="ghost" onClick={() => update.mutate({ id: c.row.original.id, patch: { active: !c.row.original.active } })}>
            {c.row.original.active ? t('devices.switchOff') : t('devices.switchOn')}
          </Button>
        </div>
      ),
    }),
  ];

  return (
    <>
      <PageHeader title={t('devices.title')} subtitle={t('devices.subtitle')} />
      <Card className="mb-6">
        <form
          className="grid items-end gap-4 md:grid-cols-4"
          onSubmit={(e) => {
            e.preventDefault();
            create.mutate({ name, stationId: stationId || null, locale, idleMinutes: 10 }, { onSuccess: (d) => (setFresh(d), setName('')) });
          }}
        >
          <TextField label={t('name')} value={name} onChange={(e) => setName(e.target.value)} required />
          <SelectField label={t('devices.station')} value={stationId} onChange={(e) => setStationId(e.target.value)}>
            <option value="">{t('devices.noStation')}</option>
            {stations.data?.map((s) => (
              <option key={s.id} value={s.id}>
                {s.code} · {s.name}
              </option>
            ))}
          </SelectField>
          <SelectField label={t('devices.language')} value={locale} onChange={(e) => setLocale(e.target.value as 'en' | 'zh-CN')}>
            <option value="en">English</option>
            <option value="zh-CN">简体中文</option>
          </SelectField>
          <Button type="submit" disabled={!name || create.isPending}>
            {t('devices.register')}
          </Button>
        </form>
        {create.error && <ErrorPanel title={t('devices.notRegistered')} message={create.error.message} />}
      </Card>
      {fresh && (
        <div className="mb-6">
          <PairingNotice device={fresh} />
        </div>
      )}
      {devices.isPending ? (
        <Loading />
      ) : devices.error ? (
        <ErrorPanel message={devices.error.message} />
      ) : (
        <DataTable data={devices.data} columns={columns} caption={t('devices.caption')} />
      )}
    </>
  );
}
