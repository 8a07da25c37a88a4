import type { QueueFilters } from './get-review-queue';

/** Under `['review']`, so one invalidation after a decision refreshes the queue, the count and histories. */
export const reviewKeys = {
  all: ['review'] as const,
  queue: (filters: QueueFilters) => ['review', 'queue', filters] as const,
  count: () => ['review', 'count'] as const,
  history: (caseId: number) => ['review', 'history', caseId] as const,
};

/** Tag curation lives under `['tags']`; the tag list is what every tag action answers with. */
export const tagKeys = {
  all: ['tags'] as const,
  list: () => ['tags', 'list'] as const,
};
