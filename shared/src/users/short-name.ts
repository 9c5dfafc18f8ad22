// Kept out of the zod schemas: a screen that shows names loads no zod for it.
/** "Dana Okafor" → "Dana O.": what a wall screen may show of a person. */
export function shortName(fullName: string): string {
  const [first, ...rest] = fullName.trim().split(/\s+/);
  const last = rest.at(-1);
  return last ? `${first} ${last[0]}.` : (first ?? '');
}
