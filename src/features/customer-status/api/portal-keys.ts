export const portalKeys = {
  all: ['public-order'] as const,
  order: (token: string) => ['public-order', token] as const,
};
