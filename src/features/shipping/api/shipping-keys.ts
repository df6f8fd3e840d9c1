export const shippingKeys = {
  all: ['shipping'] as const,
  list: (q: string) => [...shippingKeys.all, 'list', q] as const,
  packing: (orderId: string) => [...shippingKeys.all, 'packing', orderId] as const,
};
