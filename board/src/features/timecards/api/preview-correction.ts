import { useMutation } from '@tanstack/react-query';
import type { CorrectionBody, CorrectionPreview } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

/** `POST /api/timecards/corrections?preview=true`: what the correction would displace; saves nothing. */
export function previewCorrection(body: CorrectionBody): Promise<CorrectionPreview> {
  return officeApi.post<CorrectionPreview>('/timecards/corrections?preview=true', body);
}

export function usePreviewCorrection() {
  return useMutation({ mutationFn: previewCorrection });
}
