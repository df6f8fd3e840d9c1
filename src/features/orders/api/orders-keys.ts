export const ordersKeys = {
  all: ['orders'] as const,
  list: () => [...ordersKeys.all, 'list'] as const,
  detail: (id: string) => [...ordersKeys.all, 'detail', id] as const,
  customers: () => [...ordersKeys.all, 'customers'] as const,
  templates: () => [...ordersKeys.all, 'routing-templates'] as const,
};
