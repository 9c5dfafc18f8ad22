import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CorrectionPreview, PunchDto, VoidPunchBody } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** `POST /api/timecards/voids?preview=true`: what taking the punch out would displace; saves nothing. */
export function usePreviewVoidPunch() {
  return useMutation({
    mutationFn: (body: VoidPunchBody) =>
      officeApi.post<CorrectionPreview>('/timecards/voids?preview=true', body),
  });
}

/** `POST /api/timecards/voids`: takes a wrong punch out of the count; it stays on the card, struck through. */
export function useVoidPunch() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: VoidPunchBody) => officeApi.post<PunchDto>('/timecards/voids', body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.timecards.all() }),
  });
}
