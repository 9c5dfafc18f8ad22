import { CONCERN_MAX_LENGTH, cutAtWord } from '@baytime/shared';

const TITLE_MAX = 120;

/** A job-line title from a finding's note: its first line, cut at a word near 120 characters. */
export function titleFromNote(note: string): string {
  const line =
    note
      .split(/\r?\n/)
      .find((l) => l.trim())
      ?.trim() ?? note.trim();
  return cutAtWord(line.replace(/\s+/g, ' '), TITLE_MAX);
}

/** The concern of a line a finding added: what the technician found, cut at a word to fit a concern. */
export function concernFromNote(note: string): string {
  return cutAtWord(note.trim(), CONCERN_MAX_LENGTH);
}
