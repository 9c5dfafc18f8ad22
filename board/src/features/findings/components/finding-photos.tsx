import { useState, type KeyboardEvent } from 'react';
import {
  Button,
  Caption1,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  Spinner,
  makeStyles,
  shorthands,
  mergeClasses,
  tokens,
} from '@fluentui/react-components';
import type { FindingPhotoDto } from '@baytime/shared';
import { usePhotoUrl } from '../hooks/use-photo-url';

const useStyles = makeStyles({
  strip: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS, margin: 0, padding: 0 },
  item: { listStyleType: 'none' },
  thumb: {
    display: 'grid',
    placeItems: 'center',
    width: '7.5rem',
    height: '5.6rem',
    padding: 0,
    overflow: 'hidden',
    cursor: 'zoom-in',
    borderRadius: tokens.borderRadiusMedium,
    ...shorthands.border(tokens.strokeWidthThin, 'solid', tokens.colorNeutralStroke1),
    backgroundColor: tokens.colorNeutralBackground3,
    color: tokens.colorNeutralForeground3,
    ':hover': { ...shorthands.borderColor(tokens.colorBrandStroke1) },
    ':focus-visible': { outline: `2px solid ${tokens.colorStrokeFocus2}`, outlineOffset: '2px' },
  },
  small: { width: '4.5rem', height: '3.4rem' },
  img: { width: '100%', height: '100%', objectFit: 'cover', display: 'block' },
  surface: { maxWidth: 'min(92vw, 1100px)', width: 'fit-content' },
  stage: {
    display: 'grid',
    placeItems: 'center',
    minWidth: 'min(80vw, 640px)',
    minHeight: '50vh',
    backgroundColor: tokens.colorNeutralBackground3,
    borderRadius: tokens.borderRadiusMedium,
  },
  large: { maxWidth: '100%', maxHeight: '72vh', display: 'block', borderRadius: tokens.borderRadiusMedium },
  dim: { color: tokens.colorNeutralForeground3 },
});

function PhotoImage({ url, alt, className }: { url: string; alt: string; className: string }) {
  const styles = useStyles();
  const photo = usePhotoUrl(url);
  if (photo.failed) return <Caption1 className={styles.dim}>Photo not available</Caption1>;
  if (!photo.src) return <Spinner size="tiny" aria-label="Loading photo" />;
  return <img src={photo.src} alt={alt} className={className} onError={photo.onImageError} />;
}

function PhotoViewer({
  photos,
  index,
  onIndex,
  onClose,
  title,
}: {
  photos: readonly FindingPhotoDto[];
  index: number;
  onIndex: (index: number) => void;
  onClose: () => void;
  title: string;
}) {
  const styles = useStyles();
  const photo = photos[index];
  if (!photo) return null;
  const step = (delta: number) => onIndex((index + delta + photos.length) % photos.length);
  const onKeyDown = (event: KeyboardEvent) => {
    if (photos.length < 2) return;
    if (event.key === 'ArrowRight') step(1);
    if (event.key === 'ArrowLeft') step(-1);
  };
  return (
    <Dialog open onOpenChange={(_, data) => !data.open && onClose()}>
      <DialogSurface className={styles.surface} onKeyDown={onKeyDown}>
        <DialogBody>
          <DialogTitle>
            {title} · photo {index + 1} of {photos.length}
          </DialogTitle>
          <DialogContent>
            <div className={styles.stage}>
              <PhotoImage
                key={photo.id}
                url={photo.url}
                alt={`${title}, photo ${index + 1} of ${photos.length}`}
                className={styles.large}
              />
            </div>
          </DialogContent>
          <DialogActions>
            {photos.length > 1 && (
              <>
                <Button onClick={() => step(-1)} aria-label="Previous photo">
                  ‹ Previous
                </Button>
                <Button onClick={() => step(1)} aria-label="Next photo">
                  Next ›
                </Button>
              </>
            )}
            <Button appearance="primary" onClick={onClose}>
              Close
            </Button>
          </DialogActions>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}

/** Thumbnails from the small previews; a click (or Enter) opens the full photo, arrow keys page through. */
export function FindingPhotos({
  photos,
  title,
  small,
}: {
  photos: readonly FindingPhotoDto[];
  title: string;
  small?: boolean;
}) {
  const styles = useStyles();
  const [open, setOpen] = useState<number | null>(null);
  if (photos.length === 0) return <Caption1 className={styles.dim}>No photos</Caption1>;
  return (
    <>
      <ul className={styles.strip} aria-label={`Photos: ${title}`}>
        {photos.map((photo, index) => (
          <li key={photo.id} className={styles.item}>
            <button
              type="button"
              className={mergeClasses(styles.thumb, small && styles.small)}
              onClick={() => setOpen(index)}
              aria-label={`Enlarge photo ${index + 1} of ${photos.length}`}
            >
              <PhotoImage url={photo.previewUrl} alt="" className={styles.img} />
            </button>
          </li>
        ))}
      </ul>
      {open !== null && (
        <PhotoViewer
          photos={photos}
          index={open}
          onIndex={setOpen}
          onClose={() => setOpen(null)}
          title={title}
        />
      )}
    </>
  );
}
