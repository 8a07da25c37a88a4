import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { reviewKeys } from './review-keys';

export const getReviewCount = (signal?: AbortSignal) => api<{ waiting: number }>('/api/review/count', { signal });

export const reviewCountQueryOptions = () => queryOptions({ queryKey: reviewKeys.count(), queryFn: ({ signal }) => getReviewCount(signal) });

/** Cases waiting on the review desk (moderators only; the request is refused for engineers). */
export const useReviewCount = (enabled = true) => useQuery({ ...reviewCountQueryOptions(), enabled });
