import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ScanExceptionView } from '@shared/schemas/scans';
import { scanExceptionKeys } from './scan-exceptions-keys';

export const getScanExceptions = (open: 'true' | 'false' | 'all') => api.get<ScanExceptionView[]>('/scans/exceptions', { open });

export const scanExceptionsQueryOptions = (open: 'true' | 'false' | 'all' = 'true') =>
  queryOptions({ queryKey: scanExceptionKeys.list(open), queryFn: () => getScanExceptions(open), refetchInterval: 30_000 });
export const useScanExceptions = (open: 'true' | 'false' | 'all' = 'true') => useQuery(scanExceptionsQueryOptions(open));
