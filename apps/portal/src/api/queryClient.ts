import { keepPreviousData, QueryClient } from '@tanstack/vue-query';
import { ApiError } from './client.ts';

/**
 * Whether to ask again after a failed read: a lost connection or a server failure may pass, a
 * 4xx answers the same again (bad input, no right, gone, signed out), and so does a request
 * the portal itself refused to make. Two retries at most.
 */
export function shouldRetry(failureCount: number, error: unknown): boolean {
  if (!(error instanceof ApiError) || (error.status >= 400 && error.status < 500)) return false;
  return failureCount < 2;
}

/**
 * The server-state cache of the portal. Answers count as stale at once, so a page shows what it
 * has and asks again on mount, on focus and after a write; `shallow` keeps the answers plain
 * (Vue does not proxy thousands of orders), and a new key (another week, another field) keeps
 * the previous answer on screen until its own arrives.
 */
export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 0,
        refetchOnWindowFocus: true,
        retry: shouldRetry,
        placeholderData: keepPreviousData,
        shallow: true,
      },
    },
  });
}

/** The app's one client; the session store clears it at sign-out. */
export const queryClient = createQueryClient();
