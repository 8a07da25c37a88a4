import type { z } from 'zod';
import { invalid } from '../errors';

/** Parses with a shared zod schema; a failure becomes 400 with one issue per field path. */
export function parseInput<S extends z.ZodType>(schema: S, input: unknown, what = 'The request'): z.infer<S> {
  const result = schema.safeParse(input ?? {});
  if (result.success) return result.data;
  const issues = result.error.issues.map((i) => ({ path: i.path.join('.') || '(body)', message: i.message }));
  throw invalid(`${what} has ${issues.length === 1 ? 'a problem' : `${issues.length} problems`}: ${issues.map((i) => `${i.path}: ${i.message}`).join('; ')}`, issues);
}
