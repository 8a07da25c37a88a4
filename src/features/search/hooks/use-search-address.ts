import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useUrlState } from '../../../lib/url-state';
import type { FacetFilters } from '../components/SearchFacets';
import { useDebouncedValue } from './use-debounced-value';

const KEYS = ['q', 'cause', 'tag', 'status'] as const;

/**
 * A pause in typing this long ends one search. History: the first write after such a pause
 * (or after a facet or chip) adds an entry, and the writes while the words are still being
 * typed replace it. So the back button steps from search to search, never letter by letter,
 * and the address always holds what the results show.
 */
const NEW_SEARCH_AFTER_MS = 1500;

/** The Bench search's text and facets, kept in the address (`/?q=…&cause=…`). */
export function useSearchAddress() {
  const { values, write } = useUrlState(KEYS);
  const q = values.q ?? '';
  const [text, setText] = useState(q);
  const written = useRef(q);
  const lastTyped = useRef(0);

  // the address changed under us (back, forward, a link): the box shows what it says
  useEffect(() => {
    if (q === written.current) return;
    written.current = q;
    setText(q);
  }, [q]);

  const settled = useDebouncedValue(text, 200);
  useEffect(() => {
    if (settled === written.current) return;
    const now = Date.now();
    const sameSearch = now - lastTyped.current < NEW_SEARCH_AFTER_MS;
    lastTyped.current = now;
    written.current = settled;
    write({ q: settled }, { replace: sameSearch });
  }, [settled, write]);

  const filters = useMemo<FacetFilters>(() => ({ cause: values.cause, tag: values.tag, status: values.status }), [values.cause, values.tag, values.status]);

  /** A facet pressed: a new entry, so back un-presses it. */
  const setFilters = useCallback(
    (f: FacetFilters) => {
      lastTyped.current = 0;
      write({ cause: f.cause, tag: f.tag, status: f.status });
    },
    [write],
  );

  /** A symptom chip: its words, no facets, a new entry. */
  const startSearch = useCallback(
    (words: string) => {
      lastTyped.current = 0;
      written.current = words;
      setText(words);
      write({ q: words, cause: '', tag: '', status: '' });
    },
    [write],
  );

  return { text, setText, q, filters, setFilters, startSearch };
}
