import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Person, UpdatePersonInput } from '../../../../shared/schemas/auth';
import { api } from '../../../lib/api-client';
import { peopleKeys } from './list-people';

export const updatePerson = ({ id, ...patch }: UpdatePersonInput & { id: number }) =>
  api<{ person: Person }>(`/api/admin/people/${id}`, { method: 'PATCH', body: patch });

export function useUpdatePerson() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updatePerson, onSettled: () => qc.invalidateQueries({ queryKey: peopleKeys.all }) });
}
