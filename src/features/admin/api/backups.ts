import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { BackupView } from '@shared/schemas/admin';
import { adminKeys } from './admin-keys';

export const backupsQueryOptions = () => queryOptions({ queryKey: adminKeys.backups(), queryFn: () => api.get<BackupView[]>('/admin/backups') });
export const useBackups = () => useQuery(backupsQueryOptions());

export function useMakeBackup() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: () => api.post<BackupView>('/admin/backups'), onSuccess: () => qc.invalidateQueries({ queryKey: adminKeys.backups() }) });
}
