import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { CheckItem } from '../../../../shared/review/checklist';
import type { Case } from '../../../../shared/schemas/case';
import { api } from '../../../lib/api-client';
import { reviewKeys } from './review-keys';

export interface QueueEntry {
  case: Case;
  checklist: CheckItem[];
  /** The signed-in moderator wrote this case, so someone else must decide it. */
  ownCase: boolean;
  waitingSince: string;
}

export interface QueueFilters {
  cause?: string;
  attention?: boolean;
}

export function getReviewQueue(filters: QueueFilters, signal?: AbortSignal) {
  const params = new URLSearchParams();
  if (filters.cause) params.set('cause', filters.cause);
  if (filters.attention) params.set('attention', '1');
  const qs = params.toString();
  return api<{ queue: QueueEntry[]; waiting: number }>(`/api/review/queue${qs ? `?${qs}` : ''}`, { signal });
}

export const reviewQueueQueryOptions = (filters: QueueFilters) =>
  queryOptions({ queryKey: reviewKeys.queue(filters), queryFn: ({ signal }) => getReviewQueue(filters, signal), placeholderData: keepPreviousData });

export const useReviewQueue = (filters: QueueFilters) => useQuery(reviewQueueQueryOptions(filters));
