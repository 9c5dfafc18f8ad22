import { useState } from 'react';
import { pairScreenSchema } from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { usePairScreen } from '../api/pair-screen';
import { takeRefusedNotice } from '@/lib/wall-session';
import { useSchemaForm } from '@/lib/form';
import styles from './wall.module.css';

function pairErrorText(error: unknown): string {
  if (error instanceof ApiError) {
    if (error.isNetwork) return 'No connection to the shop server. Check the network and try again.';
    if (error.fieldErrors.code) return error.fieldErrors.code;
    if (error.status === 429) return error.message;
    if (error.status < 500)
      return 'That code did not work. Codes work once and expire: make a new one in the office.';
  }
  return 'The shop server could not pair this screen. Try again.';
}

/** The calm full-screen page an unpaired wall screen shows. */
export function PairScreenForm({
  initialCode = '',
  initialError,
}: {
  initialCode?: string;
  initialError?: unknown;
}) {
  const [refused] = useState(takeRefusedNotice);
  const pair = usePairScreen();
  const form = useSchemaForm(pairScreenSchema, { defaultValues: { code: initialCode } });
  const shownError =
    form.formState.errors.code?.message ??
    (pair.error ? pairErrorText(pair.error) : initialError ? pairErrorText(initialError) : null);
  const submit = form.handleSubmit((body) => pair.mutate(body));
  // The code as a person types it: capitals and digits only, six at most.
  const code = form.register('code', {
    setValueAs: (value: string) =>
      value
        .toUpperCase()
        .replace(/[^A-Z0-9]/g, '')
        .slice(0, 6),
  });

  return (
    <main className={`${styles.wall} ${styles.pairing}`}>
      <div className={styles.message}>
        <h1 className={styles.messageTitle} style={{ margin: 0, fontSize: 'inherit' }}>
          Pair this screen
        </h1>
        {refused && (
          <p className={styles.messageBody} style={{ margin: 0 }} role="status">
            The shop server no longer accepts this screen’s pairing.
          </p>
        )}
        <p className={styles.messageBody} style={{ margin: 0 }}>
          In the office, open Admin › Wall screens and make a pairing code. Type it here once; the screen
          remembers it.
        </p>
        <form className={styles.pairForm} onSubmit={(event) => void submit(event)} noValidate>
          <label htmlFor="pair-code" className={styles.messageBody}>
            Pairing code
          </label>
          <input
            id="pair-code"
            className={styles.codeInput}
            {...code}
            onInput={(event) => {
              const input = event.currentTarget;
              input.value = input.value
                .toUpperCase()
                .replace(/[^A-Z0-9]/g, '')
                .slice(0, 6);
            }}
            autoComplete="off"
            autoCapitalize="characters"
            spellCheck={false}
            inputMode="text"
            maxLength={6}
            aria-invalid={shownError ? true : undefined}
            aria-describedby={shownError ? 'pair-error' : undefined}
            autoFocus
          />
          {shownError && (
            <div id="pair-error" className={styles.pairError} role="alert">
              {shownError}
            </div>
          )}
          <button className={styles.pairButton} type="submit" disabled={pair.isPending}>
            {pair.isPending ? 'Pairing…' : 'Pair'}
          </button>
        </form>
      </div>
    </main>
  );
}
