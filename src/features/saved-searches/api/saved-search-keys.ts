export const savedSearchKeys = {
  all: ['saved-searches'] as const,
  list: () => ['saved-searches', 'list'] as const,
};
