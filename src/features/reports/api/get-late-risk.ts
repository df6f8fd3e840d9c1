import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { LateRiskOrder } from '@shared/schemas/reports';
import { reportsKeys } from './reports-keys';

export const lateRiskQueryOptions = () =>
  queryOptions({ queryKey: reportsKeys.lateRisk(), queryFn: () => api.get<LateRiskOrder[]>('/reports/late-risk'), staleTime: 60_000 });
