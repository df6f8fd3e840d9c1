import { ADMIN_ONLY } from '@shared/domain/access';
import { queryClient } from '@/lib/query-client';
import { backupsQueryOptions, useBackups, useMakeBackup } from '@/features/admin/api/backups';
import { Card, EmptyState, ErrorPanel, Loading, PageHeader } from '@/components/ui/panels';
import { Button } from '@/components/ui/button';
import { formatDateTime } from '@/lib/datetime';

export const handle = { roles: ADMIN_ONLY };
export const loader = () => queryClient.ensureQueryData(backupsQueryOptions());

export function Component() {
  const backups = useBackups();
  const make = useMakeBackup();
  return (
    <>
      <PageHeader
        title="Backups"
        subtitle="A backup copies the whole database while the floor keeps scanning. Copies are kept in the data folder under backups/; copy them off this machine as well."
        actions={
          <Button onClick={() => make.mutate()} disabled={make.isPending}>
            {make.isPending ? 'Backing up…' : 'Back up now'}
          </Button>
        }
      />
      {make.error && <ErrorPanel title="No backup made" message={make.error.message} />}
      <Card>
        {backups.isPending ? (
          <Loading />
        ) : backups.error ? (
          <ErrorPanel message={backups.error.message} />
        ) : backups.data.length === 0 ? (
          <EmptyState title="No backups yet">Make the first one now, or schedule `npm run backup` on the server.</EmptyState>
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
