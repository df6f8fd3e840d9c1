export const traysKeys = {
  all: ['trays'] as const,
  detail: (id: string) => [...traysKeys.all, 'detail', id] as const,
};
