import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, type FieldValues, type Path, type UseFormReturn } from 'react-hook-form';
import type { z } from 'zod';
import { ApiError } from './api-client';

/** react-hook-form bound to a shared zod schema (the same one the server route parses). */
export function useZodForm<S extends z.ZodType<FieldValues, FieldValues>>(schema: S, defaultValues?: z.input<S>) {
  return useForm<z.input<S>, unknown, z.output<S>>({
    resolver: zodResolver(schema),
    defaultValues: defaultValues as never,
    mode: 'onTouched',
  });
}

/** Puts the server's per-field issues on the form; returns the message for the rest. */
export function applyServerError<T extends FieldValues>(form: UseFormReturn<T, unknown, FieldValues>, err: unknown): string {
  if (!(err instanceof ApiError)) return 'Something went wrong. Try again.';
  const fields = Object.keys(form.getValues());
  let placed = 0;
  for (const issue of err.issues) {
    if (fields.includes(issue.path)) {
      form.setError(issue.path as Path<T>, { message: issue.message });
      placed++;
    }
  }
  return placed === err.issues.length && placed > 0 ? '' : err.message;
}
