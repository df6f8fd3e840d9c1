export const reportsKeys = {
  all: ['reports'] as const,
  report: (name: string, params: Record<string, string>) => [...reportsKeys.all, name, params] as const,
  filters: () => [...reportsKeys.all, 'filters'] as const,
  lateRisk: () => [...reportsKeys.all, 'late-risk'] as const,
};
