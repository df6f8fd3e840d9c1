export const mailKeys = {
  all: ['mail'] as const,
  caught: () => [...mailKeys.all, 'caught'] as const,
  queue: () => [...mailKeys.all, 'queue'] as const,
};
