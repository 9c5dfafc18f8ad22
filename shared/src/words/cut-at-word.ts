/**
 * Text of at most `max` characters: cut at a word past its middle where it can be, marked with "…". One
 * long word is cut where it must be rather than dropped whole.
 */
export function cutAtWord(text: string, max: number): string {
  if (text.length <= max) return text;
  // One character more than fits shows whether the cut falls at the end of a word.
  const space = text.slice(0, max).search(/\s\S*$/);
  const cut = space > max / 2 ? text.slice(0, space) : text.slice(0, max - 1);
  return `${cut.replace(/[\s,.;:–-]+$/u, '')}…`;
}

/** A text on one line (its line breaks and runs of spaces as single spaces), cut at a word to `max`. */
export function oneLine(text: string, max: number): string {
  return cutAtWord(text.replace(/\s+/gu, ' ').trim(), max);
}
