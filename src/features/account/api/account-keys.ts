export const accountKeys = {
  all: ['account'] as const,
  sessions: () => [...accountKeys.all, 'sessions'] as const,
  twoStep: () => [...accountKeys.all, 'two-step'] as const,
};
