export const stationsKeys = {
  all: ['stations'] as const,
  list: () => [...stationsKeys.all, 'list'] as const,
};
