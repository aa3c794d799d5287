import { useQueryClient } from '@tanstack/vue-query';
import { staleAfter, type Written } from '../api/queryKeys.ts';

/** After a write: marks what it changed stale, and waits for the answers on screen to come again. */
export function useInvalidate() {
  const client = useQueryClient();
  return async (...written: Written[]): Promise<void> => {
    const keys = new Set(written.flatMap((w) => staleAfter[w]));
    await Promise.all([...keys].map((queryKey) => client.invalidateQueries({ queryKey: [...queryKey] })));
  };
}
