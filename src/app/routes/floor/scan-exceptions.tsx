import { useState } from 'react';
import { FLOOR_LEADS } from '@shared/domain/access';
import { queryClient } from '@/lib/query-client';
import { useMe } from '@/features/auth/api/get-me';
import { scanExceptionsQueryOptions, useScanExceptions } from '@/features/scan-exceptions/api/get-scan-exceptions';
import { ScanExceptionsList } from '@/features/scan-exceptions/components/scan-exceptions-list';
import { ErrorPanel, Loading, PageHeader } from '@/components/ui/panels';
import { SelectField } from '@/components/ui/field';

export const handle = { roles: FLOOR_LEADS };
export const loader = () => queryClient.ensureQueryData(scanExceptionsQueryOptions('true'));

export function Component() {
  const [open, setOpen] = useState<'true' | 'false' | 'all'>('true');
  const list = useScanExceptions(open);
  const me = useMe();
  const canDecide = ['supervisor', 'manager', 'admin'].includes(me.data?.user.role ?? '');
  return (
    <>
      <PageHeader
        title="Refused scans"
        subtitle="Scans the server refused, kept so none is lost. Try one again once its cause is gone, or close it with what was done."
        actions={
          <SelectField label="Show" value={open} onChange={(e) => setOpen(e.target.value as typeof open)}>
            <option value="true">Open</option>
            <option value="false">Resolved</option>
            <option value="all">All</option>
          </SelectField>
        }
      />
      {list.isPending ? <Loading /> : list.error ? <ErrorPanel message={list.error.message} /> : <ScanExceptionsList items={list.data} canDecide={canDecide} />}
    </>
  );
}
