import { describe, expect, it, vi } from 'vitest';
import { emptyDraft, type IntakeDraft } from './intake-form';
import { forgetIntakeDraft, keepIntakeDraft, restoreIntakeDraft, type DraftStorage } from './intake-draft';

/** sessionStorage's behaviour over a Map. */
function tab(): DraftStorage & { items: Map<string, string> } {
  const items = new Map<string, string>();
  return {
    items,
    getItem: (key) => items.get(key) ?? null,
    setItem: (key, value) => void items.set(key, value),
    removeItem: (key) => void items.delete(key),
  };
}

const ADVISOR = 3;

function halfTyped(): IntakeDraft {
  const draft = emptyDraft();
  return {
    ...draft,
    customer: { ...draft.customer, name: 'Dana Whitfield', phone: '(555) 010-4477' },
    vehicle: { ...draft.vehicle, vin: '1M8GDM9AXKP04', make: 'Ford' },
    concern: 'Grinding from the front left when braking',
    lines: [
      { ...draft.lines[0]!, title: 'Front brake pads', bookHours: '1.2' },
      { key: 'line-x', title: 'Brake fluid flush', bookHours: '', skillLevel: '2' },
    ],
  };
}

/** The draft as typed, without the rows' React keys. */
const typed = (draft: IntakeDraft | null) =>
  draft && { ...draft, lines: draft.lines.map(({ key: _key, ...line }) => line) };

describe(restoreIntakeDraft.name, () => {
  it('gives back what the same person typed', () => {
    const storage = tab();
    const draft = halfTyped();
    keepIntakeDraft(storage, ADVISOR, draft);
    expect(typed(restoreIntakeDraft(storage, ADVISOR))).toEqual(typed(draft));
  });

  it('gives the rows keys that no line added after a reload repeats', async () => {
    const storage = tab();
    const draft = halfTyped();
    keepIntakeDraft(storage, ADVISOR, { ...draft, lines: [...draft.lines, ...draft.lines] });
    // A reload: the page's modules start again.
    vi.resetModules();
    const page = await import('./intake-draft');
    const form = await import('./intake-form');
    const restored = page.restoreIntakeDraft(storage, ADVISOR)!;
    const keys = [...restored.lines.map((line) => line.key), form.emptyLine().key, form.emptyLine().key];
    expect(new Set(keys).size).toBe(6);
  });

  it('gives nothing back to someone else signed in on the tab', () => {
    const storage = tab();
    keepIntakeDraft(storage, ADVISOR, halfTyped());
    expect(restoreIntakeDraft(storage, ADVISOR + 1)).toBeNull();
  });

  it('ignores what it cannot read: nothing kept, another shape, broken text, a refused storage', () => {
    const storage = tab();
    expect(restoreIntakeDraft(storage, ADVISOR)).toBeNull();
    for (const text of [
      '{"userId":3,"draft":{"concern":"x","lines":[{"title":"Brakes"}]}}',
      '{"userId":3',
      'null',
    ]) {
      storage.items.set('baytime.office.intake-draft', text);
      expect(restoreIntakeDraft(storage, ADVISOR), text).toBeNull();
    }
    expect(restoreIntakeDraft(null, ADVISOR)).toBeNull();
  });
});

describe(keepIntakeDraft.name, () => {
  it('keeps nothing for a form with nothing typed, and drops what was kept once it is emptied', () => {
    const storage = tab();
    keepIntakeDraft(storage, ADVISOR, emptyDraft());
    expect(storage.items.size).toBe(0);
    keepIntakeDraft(storage, ADVISOR, halfTyped());
    keepIntakeDraft(storage, ADVISOR, emptyDraft());
    expect(storage.items.size).toBe(0);
  });

  it('keeps typing going when the storage is full', () => {
    let tries = 0;
    const full: DraftStorage = {
      getItem: () => null,
      setItem: () => {
        tries += 1;
        throw new DOMException('full', 'QuotaExceededError');
      },
      removeItem: () => {},
    };
    // A throw here would fail the test: the refused write is tried once and swallowed.
    keepIntakeDraft(full, ADVISOR, halfTyped());
    keepIntakeDraft(full, ADVISOR, halfTyped());
    expect(tries).toBe(2);
  });
});

describe(forgetIntakeDraft.name, () => {
  it('leaves nothing to restore once the RO is written or cancelled', () => {
    const storage = tab();
    keepIntakeDraft(storage, ADVISOR, halfTyped());
    forgetIntakeDraft(storage);
    expect(restoreIntakeDraft(storage, ADVISOR)).toBeNull();
  });
});
