export const devicesKeys = {
  all: ['devices'] as const,
  list: () => [...devicesKeys.all, 'list'] as const,
  current: () => [...devicesKeys.all, 'current'] as const,
};
