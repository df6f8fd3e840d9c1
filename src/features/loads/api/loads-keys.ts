export const loadsKeys = {
  all: ['loads'] as const,
  overview: () => [...loadsKeys.all, 'overview'] as const,
};
