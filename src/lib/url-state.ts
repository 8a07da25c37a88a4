import { useCallback, useMemo, useRef } from 'react';
import { useSearchParams } from 'react-router-dom';

/** A change to the query string: a value sets the key, '' / null / undefined removes it. */
export type ParamChanges = Record<string, string | number | null | undefined>;

export interface ParamWriteOptions {
  /** Overwrite the current history entry instead of adding one (typing, corrections). */
  replace?: boolean;
  /** Start from an empty query instead of the current one: the changes are the whole state. */
  fresh?: boolean;
  /** Keys removed unless the changes name them (a new filter sends the table back to page 1). */
  drop?: readonly string[];
}

/** The query string after `changes`; empty values are left out, so equal states give equal links. */
export function applyParamChanges(prev: URLSearchParams, changes: ParamChanges, options: Pick<ParamWriteOptions, 'fresh' | 'drop'> = {}): URLSearchParams {
  const next = new URLSearchParams(options.fresh ? undefined : prev);
  for (const key of options.drop ?? []) if (!(key in changes)) next.delete(key);
  for (const [key, value] of Object.entries(changes)) {
    if (value === null || value === undefined || value === '') next.delete(key);
    else next.set(key, String(value));
  }
  return next;
}

/** The named keys present (and non-empty) in a query string. */
export function pickParams<K extends string>(params: URLSearchParams, keys: readonly K[]): Partial<Record<K, string>> {
  const picked: Partial<Record<K, string>> = {};
  for (const key of keys) {
    const value = params.get(key);
    if (value) picked[key] = value;
  }
  return picked;
}

/** Two query strings that mean the same state, whatever the order of their keys. */
export function sameParams(a: URLSearchParams, b: URLSearchParams): boolean {
  const sorted = (p: URLSearchParams) => {
    const copy = new URLSearchParams(p);
    copy.sort();
    return copy.toString();
  };
  return sorted(a) === sorted(b);
}

/**
 * A screen's state kept in the address (Bench search, Cases table, Diagnose form), so a link
 * reproduces the view and back/forward step through earlier ones. `values` holds the named
 * keys; `write` changes the query, adding a history entry unless told to replace.
 */
export function useUrlState<K extends string>(keys: readonly K[]) {
  const [params, setParams] = useSearchParams();
  // React Router hands out a new setter whenever the query changes; `write` stays one function,
  // so an effect that writes the address does not run again just because the address changed
  const setter = useRef(setParams);
  setter.current = setParams;
  const keyList = keys.join();
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const values = useMemo(() => pickParams(params, keys), [params, keyList]);
  const write = useCallback(
    (changes: ParamChanges, options: ParamWriteOptions = {}) => {
      // the address bar, not the last render: two writes in one tick must both count
      const prev = new URLSearchParams(window.location.search);
      const next = applyParamChanges(prev, changes, options);
      // an unchanged state is no new place to go back to
      if (sameParams(prev, next)) return;
      setter.current(next, { replace: options.replace });
    },
    [],
  );
  return { params, values, write };
}
