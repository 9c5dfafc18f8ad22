import { useEffect, useRef } from 'react';
import {
  Button,
  Caption1,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  DialogTrigger,
  Spinner,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import type { FindingPhotoDto } from '@baytime/shared';
import { usePhoto } from '@/lib/photos';

const useStyles = makeStyles({
  thumb: {
    width: '8rem',
    height: '6rem',
    padding: 0,
    overflow: 'hidden',
    borderRadius: tokens.borderRadiusMedium,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    backgroundColor: tokens.colorNeutralBackground3,
    display: 'grid',
    placeItems: 'center',
    cursor: 'zoom-in',
    ':focus-visible': { outline: `2px solid ${tokens.colorStrokeFocus2}`, outlineOffset: '2px' },
  },
  image: { width: '100%', height: '100%', objectFit: 'cover', display: 'block' },
  full: { maxWidth: '100%', maxHeight: '70vh', display: 'block', margin: '0 auto' },
  surface: { maxWidth: 'min(64rem, 95vw)' },
  failed: { color: tokens.colorNeutralForeground3, padding: tokens.spacingHorizontalXS, textAlign: 'center' },
});

/** Shows fetched image bytes through an object URL, set on the element and revoked when it goes. */
function BlobImage({ blob, alt, className }: { blob: Blob; alt: string; className: string }) {
  const ref = useRef<HTMLImageElement>(null);
  useEffect(() => {
    const image = ref.current;
    if (!image) return;
    const url = URL.createObjectURL(blob);
    image.src = url;
    return () => {
      URL.revokeObjectURL(url);
      image.removeAttribute('src');
    };
  }, [blob]);
  return <img ref={ref} alt={alt} className={className} />;
}

function AuthorisedImage({ url, alt, className }: { url: string; alt: string; className: string }) {
  const styles = useStyles();
  const image = usePhoto(url);
  if (image.isError) return <Caption1 className={styles.failed}>Photo not available</Caption1>;
  if (!image.data) return <Spinner size="tiny" aria-label="Loading photo" />;
  return <BlobImage blob={image.data} alt={alt} className={className} />;
}

/** A finding photo as a thumbnail; opening it shows the full picture. */
export function FindingPhoto({ photo, alt }: { photo: FindingPhotoDto; alt: string }) {
  const styles = useStyles();
  return (
    <Dialog>
      <DialogTrigger disableButtonEnhancement>
        <button type="button" className={styles.thumb} aria-label={`Open photo: ${alt}`}>
          <AuthorisedImage url={photo.previewUrl} alt="" className={styles.image} />
        </button>
      </DialogTrigger>
      <DialogSurface className={styles.surface}>
        <DialogBody>
          <DialogTitle>{alt}</DialogTitle>
          <DialogContent>
            <AuthorisedImage url={photo.url} alt={alt} className={styles.full} />
          </DialogContent>
          <DialogActions>
            <DialogTrigger disableButtonEnhancement>
              <Button>Close</Button>
            </DialogTrigger>
          </DialogActions>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}
