import { queryOptions, useQuery } from '@tanstack/react-query';
import { ApiError } from '@baytime/shared/client';
import { officeToken } from '@/lib/token-store';

/**
 * A finding photo's bytes. An `<img>` cannot send the bearer token, so the office fetches the image and
 * shows it from an object URL. `url` is the server's own `/api/...` address from the finding.
 */
export async function getAttachment(url: string): Promise<Blob> {
  const token = officeToken.get();
  let response: Response;
  try {
    response = await fetch(url, { headers: token ? { Authorization: `Bearer ${token}` } : {} });
  } catch {
    throw new ApiError(0, 'No connection to the shop server');
  }
  if (response.status === 401) officeToken.clear();
  if (!response.ok) throw new ApiError(response.status, response.statusText);
  return response.blob();
}

export const attachmentQueryOptions = (url: string) =>
  queryOptions({
    queryKey: ['attachment', url],
    queryFn: () => getAttachment(url),
    // A photo never changes once stored.
    staleTime: Infinity,
    gcTime: 10 * 60_000,
  });

export function useAttachment(url: string) {
  return useQuery(attachmentQueryOptions(url));
}
