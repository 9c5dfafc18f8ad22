import { useMutation } from '@tanstack/react-query';
import { ApiError } from '@baytime/shared/client';
import { officeToken } from '@/lib/token-store';
import { filenameFrom } from '../report-format';

export type ReportKind = 'labour' | 'pay';

/**
 * `GET /api/reports/<kind>?week=&format=csv` with the bearer token (a plain link cannot send it), saved
 * under the name the server gives.
 */
export async function downloadReportCsv({ kind, week }: { kind: ReportKind; week: string }): Promise<string> {
  const token = officeToken.get();
  let response: Response;
  try {
    response = await fetch(`/api/reports/${kind}?week=${encodeURIComponent(week)}&format=csv`, {
      headers: { Accept: 'text/csv', ...(token ? { Authorization: `Bearer ${token}` } : {}) },
    });
  } catch {
    throw new ApiError(0, 'No connection to the shop server');
  }
  if (response.status === 401) officeToken.clear();
  if (!response.ok) {
    const body = (await response.json().catch(() => ({}))) as { message?: string };
    throw new ApiError(response.status, body.message ?? response.statusText);
  }
  const name = filenameFrom(response.headers.get('content-disposition'), `baytime-${kind}-${week}.csv`);
  const url = URL.createObjectURL(await response.blob());
  try {
    const link = document.createElement('a');
    link.href = url;
    link.download = name;
    link.style.display = 'none';
    document.body.append(link);
    link.click();
    link.remove();
  } finally {
    // Give the browser a moment to start the download before the URL goes.
    setTimeout(() => URL.revokeObjectURL(url), 10_000);
  }
  return name;
}

export function useDownloadReportCsv() {
  return useMutation({ mutationFn: downloadReportCsv });
}
