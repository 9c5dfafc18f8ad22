import { useEffect, useId, useRef, useState } from 'react';
import {
  FINDING_SEVERITIES,
  FINDING_SEVERITY_ICONS,
  FINDING_SEVERITY_LABELS,
  MAX_FINDING_PHOTOS,
  type FindingSeverity,
} from '@baytime/shared';
import { CameraIcon, CheckIcon, CloseIcon, MeaningGlyph } from '@/components/icons';
import { Sheet } from '@/components/sheet';
import { commandProblem } from '@/lib/commands';
import { holdIdle } from '@/lib/idle-hold';
import { makeThumbnail } from '@/lib/thumbnail';
import { checkDraft, checkNewPhotos, parseHours, type DraftProblems } from '../finding-checks';
import { useCreateFinding } from '../api/create-finding';
import './findings.css';

const SEVERITIES: readonly { value: FindingSeverity; words: string }[] = FINDING_SEVERITIES.map((value) => ({
  value,
  words: FINDING_SEVERITY_LABELS[value],
}));

/** A camera trip takes the tablet away from the page: the sign-out waits longer meanwhile. */
const FINDING_IDLE_SECONDS = 5 * 60;

interface Photo {
  key: number;
  file: File;
  /** undefined while it is being made, null when the file could not be read as an image. */
  thumbnail: string | null | undefined;
}

export interface FindingSheetProps {
  jobLineId: number;
  context: string;
  onClose: () => void;
  /** The finding went: a hold for approval changes the line, so my day needs a refresh. */
  onSent: () => void;
}

export function FindingSheet({ jobLineId, context, onClose, onSent }: FindingSheetProps) {
  const [note, setNote] = useState('');
  const [severity, setSeverity] = useState<FindingSeverity | null>(null);
  const [hours, setHours] = useState('');
  const [hold, setHold] = useState(false);
  const [photos, setPhotos] = useState<Photo[]>([]);
  const [photoProblems, setPhotoProblems] = useState<string[]>([]);
  const [problems, setProblems] = useState<DraftProblems>({});
  const [progress, setProgress] = useState(0);
  const [confirmDiscard, setConfirmDiscard] = useState(false);
  const create = useCreateFinding();
  const abort = useRef<AbortController | null>(null);
  const nextKey = useRef(1);
  const noteId = useId();
  const hoursId = useId();
  const fileId = useId();

  useEffect(() => holdIdle(FINDING_IDLE_SECONDS), []);
  useEffect(() => () => abort.current?.abort(), []);

  const dirty = note.trim() !== '' || photos.length > 0 || severity !== null || hours !== '';
  const close = () => {
    // Closing during an upload cancels the upload and keeps the form.
    if (create.isPending) return abort.current?.abort();
    if (create.isSuccess || !dirty || confirmDiscard) return onClose();
    setConfirmDiscard(true);
  };

  const addFiles = (list: FileList | null) => {
    if (!list || list.length === 0) return;
    const check = checkNewPhotos(photos.length, Array.from(list));
    const added: Photo[] = check.accepted.map((file) => ({
      key: nextKey.current++,
      file,
      thumbnail: undefined,
    }));
    setPhotos((current) => [...current, ...added]);
    for (const photo of added)
      void makeThumbnail(photo.file).then((thumbnail) =>
        setPhotos((current) => current.map((p) => (p.key === photo.key ? { ...p, thumbnail } : p))),
      );
    setPhotoProblems(check.problems);
    setProblems((p) => ({ ...p, photos: undefined }));
  };

  const removePhoto = (key: number) => {
    setPhotos((current) => current.filter((p) => p.key !== key));
    setPhotoProblems([]);
  };

  const send = () => {
    const found = checkDraft({ note, severity, suggestedHours: hours, photos: photos.map((p) => p.file) });
    setProblems(found);
    if (Object.keys(found).length > 0 || severity === null) return;
    const suggested = parseHours(hours);
    abort.current = new AbortController();
    setProgress(0);
    create.mutate(
      {
        jobLineId,
        note,
        severity,
        suggestedHours: suggested === 'invalid' ? null : suggested,
        holdForApproval: hold,
        photos: photos.map((p) => p.file),
        onProgress: setProgress,
        signal: abort.current.signal,
      },
      { onSuccess: onSent },
    );
  };

  if (create.isSuccess)
    return (
      <Sheet title="Finding sent" context={context} onClose={onClose} closeLabel="Close">
        <div className="bt-finding-sent" role="status">
          <CheckIcon />
          <p>
            The advisor has it
            {photos.length > 0 ? `, with ${photos.length === 1 ? '1 photo' : `${photos.length} photos`}` : ''}
            .{hold ? ' The line is on hold until the customer answers.' : ''}
          </p>
          <button type="button" className="bt-action bt-action--go" onClick={onClose}>
            OK
          </button>
        </div>
      </Sheet>
    );

  const sending = create.isPending;
  const firstProblem =
    problems.note ?? problems.severity ?? problems.suggestedHours ?? problems.photos ?? null;

  return (
    <Sheet
      title="Add a finding"
      context={context}
      onClose={close}
      wide
      footer={
        <>
          {confirmDiscard && !sending && (
            <div className="bt-finding__discard" role="alert">
              <span>Throw this finding away?</span>
              <button type="button" className="bt-banner-button" onClick={onClose}>
                Discard
              </button>
              <button type="button" className="bt-banner-button" onClick={() => setConfirmDiscard(false)}>
                Keep it
              </button>
            </div>
          )}
          {sending && (
            <div className="bt-upload" role="status" aria-live="polite">
              <div
                className="bt-upload__bar"
                role="progressbar"
                aria-label="Upload"
                aria-valuemin={0}
                aria-valuemax={100}
                aria-valuenow={Math.round(progress * 100)}
              >
                <span style={{ width: `${progress * 100}%` }} />
              </div>
              <span className="bt-upload__words">
                {progress < 1 ? `Sending… ${Math.round(progress * 100)} %` : 'Saving…'}
              </span>
            </div>
          )}
          <p className="bt-entry__problem" role="alert">
            {firstProblem ??
              (create.error && !(create.error instanceof DOMException) ? commandProblem(create.error) : '')}
          </p>
          <button
            type="button"
            className="bt-action bt-action--go bt-finding__go"
            onClick={send}
            disabled={sending}
          >
            {sending ? 'Sending…' : 'Send finding'}
          </button>
        </>
      }
    >
      <div className="bt-finding">
        <div className="bt-finding__main">
          <label className="bt-finding__label" htmlFor={noteId}>
            What did you find?
          </label>
          <textarea
            id={noteId}
            className={`bt-finding__note${problems.note ? ' is-invalid' : ''}`}
            rows={4}
            maxLength={2000}
            value={note}
            disabled={sending}
            placeholder="For example: metal shavings on the pan magnet; rear brake pads at 3 mm"
            onChange={(event) => {
              setNote(event.target.value);
              setProblems((p) => ({ ...p, note: undefined }));
            }}
          />

          <p className="bt-finding__label" id={`${noteId}-severity`}>
            How soon does it need fixing?
          </p>
          <div
            className={`bt-severity${problems.severity ? ' is-invalid' : ''}`}
            role="radiogroup"
            aria-labelledby={`${noteId}-severity`}
          >
            {SEVERITIES.map(({ value, words }) => (
              <button
                key={value}
                type="button"
                role="radio"
                aria-checked={severity === value}
                className={`bt-severity__option bt-severity__option--${value}${severity === value ? ' is-selected' : ''}`}
                disabled={sending}
                onClick={() => {
                  setSeverity(value);
                  setProblems((p) => ({ ...p, severity: undefined }));
                }}
              >
                <MeaningGlyph name={FINDING_SEVERITY_ICONS[value]} /> {words}
              </button>
            ))}
          </div>

          <div className="bt-finding__row">
            <div className="bt-finding__hours">
              <label className="bt-finding__label" htmlFor={hoursId}>
                Suggested hours
              </label>
              <input
                id={hoursId}
                className={`bt-finding__input${problems.suggestedHours ? ' is-invalid' : ''}`}
                inputMode="decimal"
                autoComplete="off"
                placeholder="Optional"
                value={hours}
                disabled={sending}
                onChange={(event) => {
                  setHours(event.target.value);
                  setProblems((p) => ({ ...p, suggestedHours: undefined }));
                }}
              />
            </div>
            <button
              type="button"
              role="switch"
              aria-checked={hold}
              className={`bt-toggle${hold ? ' is-on' : ''}`}
              disabled={sending}
              onClick={() => setHold((h) => !h)}
            >
              <span className="bt-toggle__box" aria-hidden="true">
                {hold && <CheckIcon />}
              </span>
              <span>Hold this line for customer approval</span>
            </button>
          </div>
        </div>

        <div className="bt-finding__photos">
          <div className="bt-finding__photos-head">
            <span className="bt-finding__label">Photos</span>
            <span className="bt-finding__count">
              {photos.length} of {MAX_FINDING_PHOTOS}
            </span>
          </div>
          <input
            id={fileId}
            className="bt-visually-hidden"
            type="file"
            accept="image/*"
            capture="environment"
            multiple
            disabled={sending || photos.length >= MAX_FINDING_PHOTOS}
            onChange={(event) => {
              addFiles(event.target.files);
              event.target.value = '';
            }}
          />
          <label
            htmlFor={fileId}
            className={`bt-action bt-action--quiet bt-finding__add${sending || photos.length >= MAX_FINDING_PHOTOS ? ' is-disabled' : ''}`}
            aria-disabled={sending || photos.length >= MAX_FINDING_PHOTOS}
          >
            <CameraIcon /> {photos.length === 0 ? 'Take or add photos' : 'Add more photos'}
          </label>
          {photos.length > 0 && (
            <ul className="bt-thumbs">
              {photos.map((photo, index) => (
                <li key={photo.key} className="bt-thumb">
                  {photo.thumbnail ? (
                    <img src={photo.thumbnail} alt={`Photo ${index + 1}`} />
                  ) : (
                    <span className="bt-thumb__blank">
                      <CameraIcon />
                      {photo.thumbnail === null ? photo.file.name || `Photo ${index + 1}` : 'Loading…'}
                    </span>
                  )}
                  <button
                    type="button"
                    className="bt-thumb__remove"
                    disabled={sending}
                    onClick={() => removePhoto(photo.key)}
                    aria-label={`Remove photo ${index + 1}`}
                  >
                    <CloseIcon />
                  </button>
                </li>
              ))}
            </ul>
          )}
          {photoProblems.map((text) => (
            <p key={text} className="bt-finding__photo-problem" role="alert">
              {text}
            </p>
          ))}
        </div>
      </div>
    </Sheet>
  );
}
