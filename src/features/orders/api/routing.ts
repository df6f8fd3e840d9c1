import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { OrderDetail } from '@shared/schemas/orders';
import type { RoutingEditBody } from '@shared/schemas/routing';
import type { RoutingTemplate } from '@shared/domain/routing';
import type { Process } from '@shared/domain/vocabulary';
import { ordersKeys } from './orders-keys';

export function useEditRouting(orderId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: RoutingEditBody) => api.put<OrderDetail>(`/orders/${orderId}/routing`, body),
    onSuccess: (order) => {
      qc.setQueryData(ordersKeys.detail(orderId), order);
      return qc.invalidateQueries({ queryKey: ordersKeys.all });
    },
  });
}

export function useResetRouting(orderId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<OrderDetail>(`/orders/${orderId}/routing/reset`),
    onSuccess: (order) => {
      qc.setQueryData(ordersKeys.detail(orderId), order);
      return qc.invalidateQueries({ queryKey: ordersKeys.all });
    },
  });
}

export interface TemplateView {
  process: Process;
  template: RoutingTemplate;
  updatedAt: string | null;
}

export const templatesQueryOptions = () => queryOptions({ queryKey: ordersKeys.templates(), queryFn: () => api.get<TemplateView[]>('/routing-templates') });
export const useTemplates = () => useQuery(templatesQueryOptions());

export function useSaveTemplate() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (template: RoutingTemplate) => api.put<TemplateView>(`/routing-templates/${template.process}`, template),
    onSuccess: () => qc.invalidateQueries({ queryKey: ordersKeys.templates() }),
  });
}
