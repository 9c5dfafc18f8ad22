import { useEffect, useId, useRef, useState, type FormEvent } from 'react';
import { pairScreenSchema } from '@baytime/shared';
import { ArrowRightIcon } from '@/components/icons';
import { pairingRefusal, usePairKiosk } from '../api/pair-kiosk';
import './pairing.css';

/**
 * A tablet nobody has paired yet: the owner makes a code in the office (Admin → Kiosks) and types it
 * here once, or opens the kiosk with `?code=` in the address.
 */
export function PairKioskPanel({ codeFromAddress }: { codeFromAddress: string | null }) {
  const id = useId();
  const pair = usePairKiosk();
  const [code, setCode] = useState(codeFromAddress ?? '');
  const [problem, setProblem] = useState<string | null>(null);
  const tried = useRef(false);

  const send = (value: string) => {
    const check = pairScreenSchema.safeParse({ code: value });
    if (!check.success) return setProblem(check.error.issues[0]?.message ?? 'Check the code');
    setProblem(null);
    pair.mutate(check.data, { onError: (error) => setProblem(pairingRefusal(error)) });
  };

  useEffect(() => {
    if (!codeFromAddress || tried.current) return;
    tried.current = true;
    send(codeFromAddress);
    // Only the code the page was opened with, once.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [codeFromAddress]);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    send(code);
  };

  return (
    <form className="bt-pair" onSubmit={submit} noValidate>
      <h1 className="bt-pair__title">Pair this tablet</h1>
      <p className="bt-pair__lead">
        In the office, open <strong>Admin → Kiosks</strong> and make a pairing code. Type it here; the tablet
        stays paired until the office revokes it.
      </p>
      <label className="bt-pair__label" htmlFor={id}>
        Pairing code
      </label>
      <input
        id={id}
        className={`bt-pair__input${problem ? ' is-invalid' : ''}`}
        autoComplete="off"
        autoCapitalize="characters"
        spellCheck={false}
        maxLength={6}
        value={code}
        aria-invalid={problem !== null}
        disabled={pair.isPending}
        onChange={(event) => {
          setCode(event.target.value.toUpperCase());
          setProblem(null);
        }}
      />
      <p className="bt-pair__problem" role="alert">
        {problem}
      </p>
      <button
        type="submit"
        className="bt-action bt-action--go"
        disabled={pair.isPending || code.trim().length < 6}
      >
        {pair.isPending ? 'Pairing…' : 'Pair'} <ArrowRightIcon />
      </button>
    </form>
  );
}
