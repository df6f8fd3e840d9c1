import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CreateShipmentInput, CreatedShipment } from '@shared/schemas/shipping';
import { shippingKeys } from './shipping-keys';

export function useCreateShipment(orderId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateShipmentInput) => api.post<CreatedShipment>(`/orders/${orderId}/shipments`, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: shippingKeys.all }),
  });
}

export const packingListUrl = (orderId: string, shipmentId: string) => `/api/orders/${orderId}/shipments/${shipmentId}/packing-list.pdf`;
