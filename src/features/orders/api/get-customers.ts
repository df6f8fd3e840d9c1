import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { ordersKeys } from './orders-keys';

export interface CustomerOption {
  id: string;
  name: string;
}

export const customersQueryOptions = () => queryOptions({ queryKey: ordersKeys.customers(), queryFn: () => api.get<CustomerOption[]>('/customers') });
export const useCustomers = () => useQuery(customersQueryOptions());
