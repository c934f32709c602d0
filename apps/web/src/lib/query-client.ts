import { MutationCache, QueryCache, QueryClient } from "@tanstack/react-query";
import { isApiError } from "./api-client";

/** Query-key root of the signed-in person (see `lib/auth.ts`). */
export const meQueryKey = ["me"] as const;

function shouldRetry(failureCount: number, error: unknown): boolean {
  // Client errors will not get better by asking again; outages might.
  if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

/**
 * Builds the app's query client. Any 401 from any query or mutation means the
 * session is gone: the cached person is cleared, and the route guard sends the
 * browser to the sign-in page.
 */
export function createQueryClient(): QueryClient {
  const queryClient: QueryClient = new QueryClient({
    queryCache: new QueryCache({
      onError: (error) => {
        if (isApiError(error) && error.isUnauthenticated) queryClient.setQueryData(meQueryKey, null);
      },
    }),
    mutationCache: new MutationCache({
      onError: (error) => {
        if (isApiError(error) && error.isUnauthenticated && queryClient.getQueryData(meQueryKey)) {
          queryClient.setQueryData(meQueryKey, null);
        }
      },
    }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        retry: shouldRetry,
        refetchOnWindowFocus: true,
      },
      mutations: { retry: false },
    },
  });
  return queryClient;
}
