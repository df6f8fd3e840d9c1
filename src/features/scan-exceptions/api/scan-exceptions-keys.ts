export const scanExceptionKeys = {
  all: ['scan-exceptions'] as const,
  list: (open: 'true' | 'false' | 'all') => [...scanExceptionKeys.all, 'list', open] as const,
};
