export const calendarKeys = {
  all: ['calendar'] as const,
  view: () => [...calendarKeys.all, 'view'] as const,
};
