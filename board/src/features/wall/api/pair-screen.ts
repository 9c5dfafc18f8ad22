import { useMutation } from '@tanstack/react-query';
import type { PairScreenBody } from '@baytime/shared';
import { publicApi } from '@/lib/api-client';
import { wallToken } from '@/lib/token-store';

export interface PairAnswer {
  accessToken: string;
}

export function pairScreen(body: PairScreenBody): Promise<PairAnswer> {
  return publicApi.post<PairAnswer>('/auth/screens/pair', body);
}

/** Pairs this screen and keeps its display token. */
export function usePairScreen() {
  return useMutation({
    mutationFn: pairScreen,
    onSuccess: ({ accessToken }) => wallToken.set(accessToken),
  });
}
