import { queryOptions, useQuery } from '@tanstack/react-query';
import { ApiError } from '@baytime/shared/client';
import { officeToken } from '@/lib/token-store';
import { queryKeys } from '@/lib/query-keys';

/**
 * A finding photo's bytes, for the findings inbox and the repair-order page alike. An `<img>` cannot send the bearer token, so the page fetches the image and
 * shows it from memory. `url` is the photo's `url` or `previewUrl` as the server gives it ("/api/…").
 */
export async function getPhoto(url: string): Promise<Blob> {
  // The token goes only to this server's own API.
  if (!url.startsWith('/api/')) throw new ApiError(400, 'Not a photo of this shop');
  const token = officeToken.get();
  let response: Response;
  try {
    response = await fetch(url, { headers: token ? { Authorization: `Bearer ${token}` } : {} });
  } catch {
    throw new ApiError(0, 'No connection to the shop server');
  }
  if (response.status === 401) officeToken.clear();
  if (!response.ok)
    throw new ApiError(response.status, response.statusText || 'The photo could not be loaded');
  return response.blob();
}

export const photoQueryOptions = (url: string) =>
  queryOptions({
    queryKey: queryKeys.findingPhoto(url),
    queryFn: () => getPhoto(url),
    // A stored photo never changes.
    staleTime: Infinity,
    gcTime: 5 * 60_000,
  });

export function usePhoto(url: string) {
  return useQuery(photoQueryOptions(url));
}
