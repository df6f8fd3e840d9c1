import { PLANNING } from '@shared/domain/access';
import { ImportPanel } from '@/features/orders/components/import-panel';
import { PageHeader } from '@/components/ui/panels';

export const handle = { roles: PLANNING };

export function Component() {
  return (
    <>
      <PageHeader title="Import orders" subtitle="Check a CSV file row by row; only the rows without errors are imported, and only when you confirm." />
      <ImportPanel />
    </>
  );
}
