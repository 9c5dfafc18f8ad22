import { useEffect, useState } from 'react';
import { usePhoto } from '@/lib/photos';
import { photoUrls } from '../photo-urls';

function readAsDataUrl(blob: Blob): Promise<string> {
  return new Promise((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(String(reader.result));
    reader.onerror = () => reject(reader.error ?? new Error('Could not read the photo'));
    reader.readAsDataURL(blob);
  });
}

export interface PhotoSource {
  src: string | null;
  loading: boolean;
  failed: boolean;
  /** For the image's `onError`: a page policy that refuses `blob:` images gets a `data:` URL instead. */
  onImageError: () => void;
}

/** Something an `<img>` can show for a photo that needs the bearer token: an object URL, freed after use. */
export function usePhotoUrl(url: string): PhotoSource {
  const photo = usePhoto(url);
  const blob = photo.data;
  const [fallback, setFallback] = useState<{ blob: Blob; url: string | null } | null>(null);

  useEffect(() => {
    if (!blob) return;
    photoUrls.retain(blob);
    return () => photoUrls.release(blob);
  }, [blob]);

  const onImageError = () => {
    if (!blob) return;
    if (fallback?.blob === blob) return setFallback({ blob, url: null });
    readAsDataUrl(blob).then(
      (dataUrl) => setFallback({ blob, url: dataUrl }),
      () => setFallback({ blob, url: null }),
    );
  };

  const usingFallback = blob !== undefined && fallback?.blob === blob;
  const src = !blob ? null : usingFallback ? fallback.url : photoUrls.urlFor(blob);
  return {
    src,
    loading: photo.isPending,
    failed: photo.isError || (usingFallback && fallback.url === null),
    onImageError,
  };
}
