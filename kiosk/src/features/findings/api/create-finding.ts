import { useMutation } from '@tanstack/react-query';
import { ApiError } from '@baytime/shared/client';
import type { FindingDto, FindingSeverity } from '@baytime/shared';
import { session } from '@/lib/session';
import { sendCommand } from '@/lib/commands';
import { postWithProgress } from '@/lib/upload';

export interface NewFinding {
  jobLineId: number;
  note: string;
  severity: FindingSeverity;
  suggestedHours: number | null;
  holdForApproval: boolean;
  photos: readonly File[];
  onProgress?: (fraction: number) => void;
  signal?: AbortSignal;
}

/**
 * `POST /api/job-lines/:id/findings` as multipart: the note, severity, optional hours and hold,
 * and up to six files in `photos`. Sent with upload progress.
 */
export async function createFinding({ jobLineId, photos, onProgress, signal, ...fields }: NewFinding) {
  const body = new FormData();
  body.append('note', fields.note.trim());
  body.append('severity', fields.severity);
  if (fields.suggestedHours !== null) body.append('suggestedHours', String(fields.suggestedHours));
  if (fields.holdForApproval) body.append('holdForApproval', 'true');
  for (const photo of photos) body.append('photos', photo, photo.name || 'photo.jpg');
  const token = session.get()?.accessToken ?? null;
  try {
    return await sendCommand(() =>
      postWithProgress<FindingDto>({
        url: `/api/job-lines/${jobLineId}/findings`,
        body,
        token,
        onProgress,
        signal,
      }),
    );
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) session.clear('expired');
    throw error;
  }
}

export function useCreateFinding() {
  return useMutation({ mutationFn: createFinding, retry: false });
}
