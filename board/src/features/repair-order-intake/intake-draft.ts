import { z } from 'zod';
import { emptyDraft, emptyLine, type IntakeDraft } from './intake-form';

const KEY = 'baytime.office.intake-draft';

/** What of the Storage API the draft needs: the tab's sessionStorage, or a stand-in in tests. */
export type DraftStorage = Pick<Storage, 'getItem' | 'setItem' | 'removeItem'>;

const field = z.string();
/** A kept draft as this version of the office writes it; anything else (an older version's) is dropped. */
const keptSchema = z.object({
  userId: z.number(),
  draft: z.object({
    customer: z.object({ name: field, phone: field, email: field }),
    vehicle: z.object({
      vin: field,
      year: field,
      make: field,
      model: field,
      plate: field,
      odometer: field,
    }),
    concern: field,
    promisedDate: field,
    promisedTime: field,
    lines: z.array(z.object({ title: field, bookHours: field, skillLevel: field })).min(1),
  }),
});
type Typed = z.infer<typeof keptSchema>['draft'];

/** The draft without the rows' React keys, which belong to the page that drew them. */
function typed({ lines, ...rest }: IntakeDraft): Typed {
  return {
    ...rest,
    lines: lines.map(({ title, bookHours, skillLevel }) => ({ title, bookHours, skillLevel })),
  };
}

const BLANK = JSON.stringify(typed(emptyDraft()));

/**
 * Keeps what this person typed for the tab's life (sessionStorage: gone with the tab), so a sign-in
 * that ran out or a reload does not lose it. A draft with nothing typed is not kept.
 */
export function keepIntakeDraft(storage: DraftStorage | null, userId: number, draft: IntakeDraft): void {
  const kept = typed(draft);
  try {
    if (JSON.stringify(kept) === BLANK) storage?.removeItem(KEY);
    else storage?.setItem(KEY, JSON.stringify({ userId, draft: kept }));
  } catch {
    // A full or refused storage only means the draft is not kept.
  }
}

/** This person's kept draft, with fresh row keys; null when there is none, or it is someone else's. */
export function restoreIntakeDraft(storage: DraftStorage | null, userId: number): IntakeDraft | null {
  try {
    const kept = keptSchema.safeParse(JSON.parse(storage?.getItem(KEY) ?? 'null'));
    if (!kept.success || kept.data.userId !== userId) return null;
    const { draft } = kept.data;
    return { ...draft, lines: draft.lines.map((line) => ({ ...emptyLine(), ...line })) };
  } catch {
    return null;
  }
}

/** Saved, cancelled or cleared: nothing is kept any more. */
export function forgetIntakeDraft(storage: DraftStorage | null): void {
  try {
    storage?.removeItem(KEY);
  } catch {
    // nothing was kept then either
  }
}

/** The tab's sessionStorage, or null where the browser refuses it. */
export function tabStorage(): DraftStorage | null {
  try {
    return window.sessionStorage;
  } catch {
    return null;
  }
}
