export const notificationKeys = {
  all: ['notifications'] as const,
  prefs: () => ['notifications', 'prefs'] as const,
  watches: () => ['notifications', 'watches'] as const,
};
