import { useMutation, useQueryClient } from '@tanstack/react-query';

/**
 * A resolution changes the exceptions list, the timecard and the pay summary alike: every query on screen
 * is read again.
 */
export function useResolution<Args>(send: (args: Args) => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: send, onSuccess: () => queryClient.invalidateQueries() });
}
