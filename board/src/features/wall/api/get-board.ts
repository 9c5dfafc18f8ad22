import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BoardSnapshot } from '@baytime/shared';
import type { ApiClient } from '@baytime/shared/client';

export function getBoard(api: ApiClient): Promise<BoardSnapshot> {
  return api.get<BoardSnapshot>('/board');
}

export const boardQueryOptions = (api: ApiClient) =>
  queryOptions({ queryKey: ['board'], queryFn: () => getBoard(api) });

/** One-off read of the board over HTTP; the live views use the socket instead. */
export function useBoard(api: ApiClient) {
  return useQuery(boardQueryOptions(api));
}
