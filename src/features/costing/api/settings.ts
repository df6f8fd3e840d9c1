import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CostingSettings, CostingSettingsPatch } from '@shared/schemas/costing';

const key = ['admin', 'costing'] as const;

export const costingSettingsQueryOptions = () => queryOptions({ queryKey: key, queryFn: () => api.get<CostingSettings>('/admin/costing') });
export const useCostingSettings = () => useQuery(costingSettingsQueryOptions());

export function useSaveCostingSettings() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (patch: CostingSettingsPatch) => api.put<CostingSettings>('/admin/costing', patch),
    onSuccess: (saved) => qc.setQueryData(key, saved),
  });
}
