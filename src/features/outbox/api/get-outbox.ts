import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OutboxMessage } from '../../../../shared/schemas/auth';
import { api } from '../../../lib/api-client';

export const outboxKeys = { all: ['outbox'] as const };

export const getOutbox = () => api<{ messages: OutboxMessage[] }>('/api/dev/outbox');

export const outboxQueryOptions = () => queryOptions({ queryKey: outboxKeys.all, queryFn: getOutbox, staleTime: 0 });

/** Mails leave through a background queue, so an open outbox looks again every few seconds. */
const OUTBOX_POLL_MS = 3000;

export const useOutbox = (enabled = true) => useQuery({ ...outboxQueryOptions(), enabled, refetchInterval: OUTBOX_POLL_MS });
