import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { FLOOR_LEADS } from '@shared/domain/access';
import { queryClient } from '@/lib/query-client';
import { useMe } from '@/features/auth/api/get-me';
import { scanExceptionsQueryOptions, useScanExceptions } from '@/features/scan-exceptions/api/get-scan-exceptions';
import { ScanExceptionsList } from '@/features/scan-exceptions/components/scan-exceptions-list';
import { ErrorPanel, Loading, PageHeader } from '@/components/ui/panels';
import { SelectField } from '@/components/ui/field';
import { describeRefusal } from '@/features/station/lib/refusal-text';
import { currentLocale } from '@/lib/i18n';
import type { DescribeRefusal } from '@/features/scan-exceptions/lib/exception-text';

// the same words the tablet used when it refused the scan, in the reader's language
const describe: DescribeRefusal = (code, params, time) => describeRefusal(currentLocale(), code, params, time);

export const handle = { roles: FLOOR_LEADS };
export const loader = () => queryClient.ensureQueryData(scanExceptionsQueryOptions('true'));

export function Component() {
  const { t } = useTranslation('scanExceptions');
  const [open, setOpen] = useState<'true' | 'false' | 'all'>('true');
  const list = useScanExceptions(open);
  const me = useMe();
  const canDecide = ['supervisor', 'manager', 'admin'].includes(me.data?.user.role ?? '');
  return (
    <>
      <PageHeader
        title={t('page.title')}
        subtitle={t('page.subtitle')}
        actions={
          <SelectField label={t('page.show')} value={open} onChange={(e) => setOpen(e.target.value as typeof open)}>
            <option value="true">{t('page.open')}</option>
            <option value="false">{t('page.resolved')}</option>
            <option value="all">{t('page.all')}</option>
          </SelectField>
        }
      />
      {list.isPending ? (
        <Loading />
      ) : list.error ? (
        <ErrorPanel message={list.error.message} />
      ) : (
        <ScanExceptionsList items={list.data} canDecide={canDecide} describe={describe} />
      )}
    </>
  );
}
