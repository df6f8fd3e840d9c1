export const liveKeys = {
  all: ['live'] as const,
  wall: () => [...liveKeys.all, 'wall'] as const,
  wip: () => [...liveKeys.all, 'wip'] as const,
  device: () => [...liveKeys.all, 'device'] as const,
};
