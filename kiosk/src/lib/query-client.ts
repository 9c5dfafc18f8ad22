import { QueryClient } from '@tanstack/react-query';
import { ApiError } from '@baytime/shared/client';

export const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      staleTime: 15_000,
      retry: (failureCount, error) => {
        if (error instanceof ApiError && !error.isNetwork && error.status < 500) return false;
        return failureCount < 3;
      },
    },
    // Commands go now or fail now with a message: a paused mutation would leave a tech looking at
    // "Sending…" with no idea whether the tap counted. (Punches have their own durable outbox.)
    mutations: { networkMode: 'always', retry: false },
  },
});
