import '@fontsource/barlow-semi-condensed/500.css';
import '@fontsource/barlow-semi-condensed/700.css';
import { useCallback, useEffect, useState } from 'react';
import { useSearchParams } from 'react-router';
import { pairScreenSchema } from '@baytime/shared';
import { wallToken } from '@/lib/token-store';
import { pairScreen, type PairAnswer } from '@/features/wall/api/pair-screen';
import { useWallToken } from '@/features/wall/hooks/use-wall-token';
import { PairScreenForm } from '@/features/wall/components/pair-screen-form';
import { WallBoard } from '@/features/wall/components/wall-board';
import styles from '@/features/wall/components/wall.module.css';

// A code is used once: a second request (React's double effects, a re-render) shares the first.
const pairings = new Map<string, Promise<PairAnswer>>();

function pairOnce(code: string): Promise<PairAnswer> {
  let pending = pairings.get(code);
  if (!pending) {
    pending = pairScreen({ code });
    pairings.set(code, pending);
  }
  return pending;
}

interface AutoPairResult {
  code: string;
  error: unknown;
}

/** Pairs from `/wall?code=XXXXXX`, then drops the code from the address so a reload does not reuse it. */
function AutoPair({ code, onSettled }: { code: string; onSettled: (result: AutoPairResult) => void }) {
  useEffect(() => {
    let current = true;
    const parsed = pairScreenSchema.safeParse({ code });
    if (!parsed.success) {
      onSettled({ code, error: new Error(parsed.error.issues[0]?.message) });
      return;
    }
    pairOnce(parsed.data.code).then(
      ({ accessToken }) => {
        if (!current) return;
        wallToken.set(accessToken);
        onSettled({ code, error: null });
      },
      (error: unknown) => {
        if (current) onSettled({ code, error });
      },
    );
    return () => {
      current = false;
    };
  }, [code, onSettled]);

  return (
    <main className={styles.wall}>
      <div className={styles.message} role="status">
        Pairing this screen…
      </div>
    </main>
  );
}

export function Component() {
  const token = useWallToken();
  const [params, setParams] = useSearchParams();
  const code = params.get('code');
  const [result, setResult] = useState<AutoPairResult | null>(null);

  const settled = useCallback(
    (outcome: AutoPairResult) => {
      setResult(outcome);
      setParams(
        (current) => {
          const next = new URLSearchParams(current);
          next.delete('code');
          return next;
        },
        { replace: true },
      );
    },
    [setParams],
  );

  useEffect(() => {
    document.title = 'Baytime wall';
  }, []);

  if (code) return <AutoPair code={code} onSettled={settled} />;
  if (!token)
    return (
      <PairScreenForm
        key={result?.code ?? 'blank'}
        initialCode={result?.error ? result.code.toUpperCase().slice(0, 6) : ''}
        initialError={result?.error ?? undefined}
      />
    );
  return <WallBoard token={token} />;
}

export { RootError as ErrorBoundary } from './root-fallbacks';
