export const adminKeys = {
  all: ['admin'] as const,
  reasonCodes: () => [...adminKeys.all, 'reason-codes'] as const,
  backups: () => [...adminKeys.all, 'backups'] as const,
  factoryLanguage: () => [...adminKeys.all, 'factory-language'] as const,
};
