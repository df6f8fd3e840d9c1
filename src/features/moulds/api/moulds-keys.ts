export const mouldsKeys = {
  all: ['moulds'] as const,
  list: () => [...mouldsKeys.all, 'list'] as const,
};
