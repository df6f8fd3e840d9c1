import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { FactoryLanguage } from '@shared/schemas/admin';
import { adminKeys } from './admin-keys';

export const factoryLanguageQueryOptions = () =>
  queryOptions({ queryKey: adminKeys.factoryLanguage(), queryFn: () => api.get<FactoryLanguage>('/admin/factory-language') });
export const useFactoryLanguage = () => useQuery(factoryLanguageQueryOptions());

export function useSaveFactoryLanguage() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: FactoryLanguage) => api.put<FactoryLanguage>('/admin/factory-language', body),
    onSuccess: (data) => qc.setQueryData(adminKeys.factoryLanguage(), data),
  });
}
