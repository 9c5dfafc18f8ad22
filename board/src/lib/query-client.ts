import { QueryClient } from '@tanstack/react-query';
import { ApiError } from '@baytime/shared/client';

export const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      staleTime: 30_000,
      refetchOnWindowFocus: true,
      // A refusal will not change on retry; a dropped link might.
      retry: (count, error) =>
        count < 3 && (!(error instanceof ApiError) || error.isNetwork || error.status >= 500),
    },
    mutations: { retry: false },
  },
});
