import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { PartSuggestionsSchema } from '../../shared/schemas/parts';
import { api } from './api-client';

/**
 * Search as you type, shared by the header search and the quick-order pad (both features use it, so it sits below
 * them). Fewer characters than SUGGEST_MIN_LENGTH are not worth a request.
 */
export const SUGGEST_MIN_LENGTH = 2;
export const SUGGEST_DEBOUNCE_MS = 150;

export const suggestionKeys = {
  all: ['part-suggestions'] as const,
  for: (q: string) => [...suggestionKeys.all, q] as const,
};

export function getSuggestions(q: string, signal?: AbortSignal) {
  return api(`/parts/suggest?q=${encodeURIComponent(q)}`, PartSuggestionsSchema, { signal });
}

export const suggestionsQueryOptions = (q: string) =>
  queryOptions({
    queryKey: suggestionKeys.for(q),
    queryFn: ({ signal }) => getSuggestions(q, signal),
    // The list stays while the next keystroke's answer is on its way, so it does not flicker shut.
    placeholderData: keepPreviousData,
    staleTime: 30_000,
  });

/** Waits until typing pauses before the value moves on. */
export function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

/** Suggestions for what is typed, asked for once typing pauses. */
export function useSuggestions(typed: string) {
  const q = useDebounced(typed.trim(), SUGGEST_DEBOUNCE_MS);
  const enabled = q.length >= SUGGEST_MIN_LENGTH && typed.trim().length >= SUGGEST_MIN_LENGTH;
  const query = useQuery({ ...suggestionsQueryOptions(q), enabled });
  return { ...query, data: enabled ? query.data : undefined };
}
