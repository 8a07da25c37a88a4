import { z } from 'zod';
import { caseStatusSchema } from './case';
import type { HypothesisCause } from './diagnosis';

/** `GET /api/search` query. `q` is kept as typed: a trailing space says the last word is finished. */
export const searchQuerySchema = z.object({
  q: z.string().max(300, 'A search is at most 300 characters').default(''),
  cause: z.string().trim().max(40).optional(),
  tag: z.string().trim().toLowerCase().max(40).optional(),
  status: caseStatusSchema.optional(),
  page: z.coerce.number().int().min(1, 'page starts at 1').max(500).default(1),
  pageSize: z.coerce.number().int().min(1).max(50, 'pageSize is at most 50').default(20),
});
export type SearchQuery = z.infer<typeof searchQuerySchema>;

export const HIGHLIGHT_FIELDS = ['title', 'summary', 'narrative', 'fix', 'lesson'] as const;
export type HighlightField = (typeof HIGHLIGHT_FIELDS)[number];

/**
 * A piece of a case's text with the matched words located, never marked up: `ranges` are
 * [start, end) offsets into `text` (UTF-16 code units), so the client wraps them in its own
 * elements and no HTML from a case is ever rendered. A snippet cut from a longer text starts
 * or ends with "…".
 */
export interface SearchHighlight {
  field: HighlightField;
  text: string;
  ranges: [number, number][];
}

export interface SearchResult {
  id: number;
  title: string;
  summary: string;
  cause: string | null;
  score: number;
  highlights: SearchHighlight[];
}

/** How a symptom query was read: "read as: amplitude ×0.1 → attenuation mismatch". */
export interface SearchReading {
  text: string;
  observations: string[];
  causes: { cause: HypothesisCause; likelihood: number }[];
}

export interface SearchResponse {
  results: SearchResult[];
  facets: { cause: Record<string, number>; tags: Record<string, number>; status: Record<string, number> };
  total: number;
  reading: SearchReading | null;
}

export interface SimilarCase {
  id: number;
  title: string;
  summary: string;
  cause: string | null;
  score: number;
}
export interface SimilarResponse {
  similar: SimilarCase[];
}
