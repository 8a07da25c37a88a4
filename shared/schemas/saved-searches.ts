import { z } from 'zod';
import { stripControlChars } from './clean-text';

export const SAVED_SEARCH_DELIVERIES = ['mail', 'digest'] as const;
export type SavedSearchDelivery = (typeof SAVED_SEARCH_DELIVERIES)[number];

/** A user may keep this many searches: each one is checked against every newly verified case. */
export const MAX_SAVED_SEARCHES = 20;

/** Body of `POST /api/profile/saved-searches`: the Bench search as it stands, its facets, a name, and how to be told. */
export const savedSearchInputSchema = z
  .object({
    name: z.string({ error: 'Give the search a name' }).overwrite(stripControlChars).trim().min(1, 'Give the search a name').max(80, 'A name has at most 80 characters'),
    q: z.string().overwrite(stripControlChars).trim().max(300, 'A search is at most 300 characters').default(''),
    cause: z.string().trim().min(1).max(40).optional(),
    tag: z.string().trim().toLowerCase().min(1).max(40).optional(),
    delivery: z.enum(SAVED_SEARCH_DELIVERIES, { error: 'delivery is mail or digest' }),
  })
  .refine((v) => v.q !== '' || v.cause || v.tag, { message: 'Type a symptom or pick a facet first: an empty search matches every case', path: ['q'] });
export type SavedSearchInput = z.infer<typeof savedSearchInputSchema>;

export interface SavedSearch {
  id: number;
  name: string;
  q: string;
  cause: string | null;
  tag: string | null;
  delivery: SavedSearchDelivery;
  createdAt: string;
}
