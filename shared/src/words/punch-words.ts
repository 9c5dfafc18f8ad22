import type { BreakKind, PunchKind } from '../punches/punches.schema.js';

/** One word for each punch kind: the kiosk's buttons, timecards, the corrections dialog, exports. */
export const PUNCH_WORDS: Readonly<Record<PunchKind, string>> = {
  'shift-in': 'Shift start',
  'shift-out': 'Shift end',
  'break-start': 'Break start',
  'break-end': 'Break end',
  'job-on': 'Clock on',
  'job-off': 'Clock off',
};

/** A break's kind, after its punch: "Break start · meal". */
export const BREAK_KIND_WORDS: Readonly<Record<BreakKind, string>> = {
  meal: 'meal',
  rest: 'rest',
};

/** How each kind of break is paid, where a foreman picks one. */
export const BREAK_KIND_PAY_WORDS: Readonly<Record<BreakKind, string>> = {
  meal: 'Meal break (unpaid)',
  rest: 'Rest break (paid)',
};

/** A punch in words, with the break's kind when it has one: "Break start · rest". */
export function punchWords(punch: { kind: PunchKind; breakKind?: BreakKind | null }): string {
  return punch.kind === 'break-start' && punch.breakKind
    ? `${PUNCH_WORDS[punch.kind]} · ${BREAK_KIND_WORDS[punch.breakKind]}`
    : PUNCH_WORDS[punch.kind];
}

/** A word set entry inside a sentence: "a shift end may be missing". */
export function inSentence(words: string): string {
  return words.charAt(0).toLowerCase() + words.slice(1);
}

/** A word set entry opening a sentence: "Line 2 “Brake pads” added". */
export function atStart(words: string): string {
  return words.charAt(0).toUpperCase() + words.slice(1);
}
