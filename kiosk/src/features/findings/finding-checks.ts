import {
  FINDING_PHOTO_TYPES,
  MAX_FINDING_PHOTO_BYTES,
  MAX_FINDING_PHOTOS,
  type FindingSeverity,
} from '@baytime/shared';

export interface PhotoLike {
  name: string;
  size: number;
  type: string;
}

export interface PhotoCheck<T extends PhotoLike> {
  accepted: T[];
  /** One plain sentence per refused photo, or about the count. */
  problems: string[];
}

const MAX_MB = MAX_FINDING_PHOTO_BYTES / (1024 * 1024);

const label = (photo: PhotoLike) => (photo.name ? `“${photo.name}”` : 'A photo');

/**
 * Which of the newly picked photos can join the finding: at most six in all, each a JPEG, PNG or
 * WebP of at most 10 MB. Checked before sending, so nothing is uploaded only to be refused.
 */
export function checkNewPhotos<T extends PhotoLike>(kept: number, added: readonly T[]): PhotoCheck<T> {
  const accepted: T[] = [];
  const problems: string[] = [];
  let overCount = 0;
  for (const photo of added) {
    if (photo.size > MAX_FINDING_PHOTO_BYTES) {
      problems.push(`${label(photo)} is larger than ${MAX_MB} MB: take it again at a smaller size.`);
      continue;
    }
    // Some cameras give no type at all; the server checks the content anyway.
    if (photo.type && !(FINDING_PHOTO_TYPES as readonly string[]).includes(photo.type)) {
      problems.push(`${label(photo)} is not a JPEG, PNG or WebP photo.`);
      continue;
    }
    if (kept + accepted.length >= MAX_FINDING_PHOTOS) {
      overCount += 1;
      continue;
    }
    accepted.push(photo);
  }
  if (overCount > 0)
    problems.push(
      `Up to ${MAX_FINDING_PHOTOS} photos per finding: ${overCount === 1 ? '1 photo was' : `${overCount} photos were`} left out. Remove one to add another.`,
    );
  return { accepted, problems };
}

export interface FindingDraft {
  note: string;
  severity: FindingSeverity | null;
  suggestedHours: string;
  photos: readonly PhotoLike[];
}

export type DraftProblems = Partial<Record<'note' | 'severity' | 'suggestedHours' | 'photos', string>>;

/** Suggested hours as typed: empty is fine; otherwise 0.1 to 99 hours. */
export function parseHours(text: string): number | null | 'invalid' {
  const trimmed = text.trim().replace(',', '.');
  if (trimmed === '') return null;
  if (!/^\d{1,2}(\.\d{0,2})?$|^\.\d{1,2}$/.test(trimmed)) return 'invalid';
  const value = Number(trimmed);
  return value >= 0.1 && value <= 99 ? value : 'invalid';
}

/** What stops the finding from going, field by field; empty when it can go. */
export function checkDraft(draft: FindingDraft): DraftProblems {
  const problems: DraftProblems = {};
  if (draft.note.trim() === '') problems.note = 'Say what you found.';
  else if (draft.note.trim().length > 2000) problems.note = 'Keep the note under 2000 characters.';
  if (draft.severity === null) problems.severity = 'Pick how soon it needs fixing.';
  if (parseHours(draft.suggestedHours) === 'invalid')
    problems.suggestedHours = 'Suggested hours is a number like 1.5, from 0.1 to 99.';
  const photoCheck = checkNewPhotos(0, draft.photos);
  if (photoCheck.problems.length > 0) problems.photos = photoCheck.problems[0];
  return problems;
}
