import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Person } from '../../../../shared/schemas/auth';
import { api } from '../../../lib/api-client';

export const peopleKeys = { all: ['people'] as const, list: () => ['people', 'list'] as const };

export const listPeople = () => api<{ people: Person[]; pendingInvitations: string[] }>('/api/admin/people');

export const peopleQueryOptions = () => queryOptions({ queryKey: peopleKeys.list(), queryFn: listPeople });

export const usePeople = () => useQuery(peopleQueryOptions());
