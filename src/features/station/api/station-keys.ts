export const stationKeys = {
  all: ['station'] as const,
  device: () => [...stationKeys.all, 'device'] as const,
  queue: (stationId: string) => [...stationKeys.all, 'queue', stationId] as const,
  reasonCodes: () => [...stationKeys.all, 'reason-codes'] as const,
};
