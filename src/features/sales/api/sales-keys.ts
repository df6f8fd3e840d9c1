export const salesKeys = {
  all: ['sales'] as const,
  search: (q: string) => [...salesKeys.all, 'search', q] as const,
  order: (id: string) => [...salesKeys.all, 'order', id] as const,
  owners: () => [...salesKeys.all, 'owners'] as const,
};
