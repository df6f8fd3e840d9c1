import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { UserView } from '@shared/schemas/users';
import { usersKeys } from './users-keys';

export const usersQueryOptions = () => queryOptions({ queryKey: usersKeys.list(), queryFn: () => api.get<UserView[]>('/users') });
export const useUsers = () => useQuery(usersQueryOptions());
