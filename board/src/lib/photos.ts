import { queryOptions, useQuery } from '@tanstack/react-query';
import { ApiError } from '@baytime/shared/client';
import { officeApi } from './api-client';
import { queryKeys } from './query-keys';

/**
 * A finding photo's bytes, for the findings inbox and the repair-order page alike. An `<img>` cannot send the bearer token, so the page fetches the image and
 * shows it from memory. `url` is the photo's `url` or `previewUrl` as the server gives it ("/api/…").
 */
export async function getPhoto(url: string): Promise<Blob> {
  // The token goes only to this server's own API.
  if (!url.startsWith('/api/')) throw new ApiError(400, 'Not a photo of this shop');
  return (await officeApi.blob(url.slice('/api'.length), 'image/*')).blob;
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
