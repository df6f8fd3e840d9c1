import { Trans, useTranslation } from 'react-i18next';
import { ADMIN_ONLY } from '@shared/domain/access';
import { queryClient } from '@/lib/query-client';
import { backupsQueryOptions, useBackups, useMakeBackup } from '@/features/admin/api/backups';
import { Card, EmptyState, ErrorPanel, Loading, PageHeader } from '@/components/ui/panels';
import { Button } from '@/components/ui/button';
import { formatDateTime } from '@/lib/datetime';

export const handle = { roles: ADMIN_ONLY };
export const loader = () => queryClient.ensureQueryData(backupsQueryOptions());

export function Component() {
  const { t } = useTranslation('admin');
  const backups = useBackups();
  const make = useMakeBackup();
  return (
    <>
      <PageHeader
        title={t('backups.title')}
        subtitle={t('backups.subtitle', { folder: 'backups/' })}
        actions={
          <Button onClick={() => make.mutate()} disabled={make.isPending}>
            {make.isPending ? t('backups.working') : t('backups.now')}
          </Button>
        }
      />
      {make.error && <ErrorPanel title={t('backups.failed')} message={make.error.message} />}
      <Card>
        {backups.isPending ? (
          <Loading />
        ) : backups.error ? (
          <ErrorPanel message={backups.error.message} />
        ) : backups.data.length === 0 ? (
          <EmptyState title={t('backups.none')}>
            <Trans t={t} i18nKey="backups.noneHint" values={{ command: 'npm run backup' }} components={{ code: <code /> }} />
          </EmptyState>
        ) : (
          <ul className="divide-y divide-harbour-100">
            {backups.data.map((b) => (
              <li key={b.file} className="flex flex-wrap justify-between gap-2 py-3">
                <span className="font-mono">{b.file}</span>
                <span className="text-harbour-700">
                  {(b.sizeBytes / 1024 / 1024).toFixed(1)} MB · {formatDateTime(b.createdAt)}
                </span>
              </li>
            ))}
          </ul>
        )}
      </Card>
    </>
  );
}
