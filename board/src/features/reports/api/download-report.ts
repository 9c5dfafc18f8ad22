import { useMutation } from '@tanstack/react-query';
import { officeApi } from '@/lib/api-client';
import { filenameFrom } from '../report-format';

export type ReportKind = 'labour' | 'pay';

/**
 * `GET /api/reports/<kind>?week=&format=csv` with the bearer token (a plain link cannot send it), saved
 * under the name the server gives.
 */
export async function downloadReportCsv({ kind, week }: { kind: ReportKind; week: string }): Promise<string> {
  const { blob, disposition } = await officeApi.blob(
    `/reports/${kind}?week=${encodeURIComponent(week)}&format=csv`,
    'text/csv',
  );
  const name = filenameFrom(disposition, `baytime-${kind}-${week}.csv`);
  const url = URL.createObjectURL(blob);
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
