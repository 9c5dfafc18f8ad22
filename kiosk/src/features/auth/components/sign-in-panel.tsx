import { useCallback, useEffect, useRef, useState } from 'react';
import { badgeProblem, pinProblem, type SignInAnswer } from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { ArrowRightIcon, CheckIcon } from '@/components/icons';
import { useNow } from '@/hooks/use-now';
import {
  NO_CONNECTION,
  lockText,
  signInLockedUntil,
  signInRefusal,
  useBadgeSignIn,
} from '../api/badge-sign-in';
import { Keypad, useHardwareKeys } from '@/components/keypad';
import './sign-in-panel.css';

type Step = 'badge' | 'pin';

const MAX_DIGITS = 8;
/** A half-typed badge or PIN is wiped when the tablet is left alone this long. */
const ABANDON_MS = 30_000;

export interface SignInPanelProps {
  onSignedIn: (answer: SignInAnswer) => void;
  /** Shown above the entry until the first key press, e.g. why the last person was signed out. */
  notice?: string | null;
  onNoticeSeen?: () => void;
  /** The server cannot be reached: badge and PIN go here instead, for a punch recorded offline. */
  offline?: boolean;
  onOffline?: (badge: string, pin: string) => void;
}

export function SignInPanel({
  onSignedIn,
  notice,
  onNoticeSeen,
  offline = false,
  onOffline,
}: SignInPanelProps) {
  const [step, setStep] = useState<Step>('badge');
  const [badge, setBadge] = useState('');
  const [pin, setPin] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  // Too many wrong tries on a badge: the server's lock, counted down until it lifts. Other badges
  // may still sign in; the same one is not sent again until then.
  const [lock, setLock] = useState<{ badge: string; until: number } | null>(null);
  const [lockShown, setLockShown] = useState(false);
  const now = useNow(1000);
  const lockLeft = lock ? Math.ceil((lock.until - now) / 1000) : 0;
  const shownProblem = lockShown && lockLeft > 0 ? lockText(lockLeft) : problem;
  const showProblem = (text: string | null) => {
    setLockShown(false);
    setProblem(text);
  };
  const signIn = useBadgeSignIn();
  // A "no connection" problem is stale once the link is back.
  const [wasOffline, setWasOffline] = useState(offline);
  if (offline !== wasOffline) {
    setWasOffline(offline);
    if (!offline && problem === NO_CONNECTION) setProblem(null);
  }
  const abandonTimer = useRef<ReturnType<typeof setTimeout>>(undefined);

  const reset = useCallback(() => {
    setStep('badge');
    setBadge('');
    setPin('');
  }, []);

  const touched = useCallback(() => {
    clearTimeout(abandonTimer.current);
    abandonTimer.current = setTimeout(() => {
      reset();
      setProblem(null);
      setLockShown(false);
    }, ABANDON_MS);
    onNoticeSeen?.();
  }, [reset, onNoticeSeen]);

  useEffect(() => () => clearTimeout(abandonTimer.current), []);

  const setValue = step === 'badge' ? setBadge : setPin;

  const digit = (d: string) => {
    touched();
    showProblem(null);
    setValue((v) => (v.length >= MAX_DIGITS ? v : v + d));
  };
  const backspace = () => {
    touched();
    setValue((v) => v.slice(0, -1));
  };
  const clear = () => {
    touched();
    showProblem(null);
    if (step === 'pin' && pin === '') setStep('badge');
    else setValue('');
  };

  const next = () => {
    touched();
    if (step === 'badge') {
      const wrongBadge = badgeProblem(badge);
      if (wrongBadge) return showProblem(wrongBadge);
      showProblem(null);
      setStep('pin');
      return;
    }
    const wrong = badgeProblem(badge) ?? pinProblem(pin);
    if (wrong) return showProblem(wrong);
    showProblem(null);
    if (lock?.badge === badge && lockLeft > 0) {
      reset();
      return setLockShown(true);
    }
    if (offline && onOffline) {
      reset();
      return onOffline(badge, pin);
    }
    signIn.mutate(
      { badge, pin },
      {
        onSuccess: (answer) => {
          reset();
          onSignedIn(answer);
        },
        onError: (error) => {
          reset();
          const until = signInLockedUntil(error, Date.now());
          if (until !== null) {
            setLock({ badge, until });
            setProblem(null);
            setLockShown(true);
          } else if (onOffline && error instanceof ApiError && error.isNetwork) onOffline(badge, pin);
          else showProblem(signInRefusal(error));
        },
      },
    );
  };

  // A USB badge reader or a keyboard types digits and Enter; Escape clears like the Clear key.
  useHardwareKeys(
    { onDigit: digit, onBackspace: backspace, onClear: clear, onEscape: clear, onEnter: next },
    !signIn.isPending,
  );

  const busy = signIn.isPending;
  const label = step === 'badge' ? 'Badge number' : `PIN for badge ${badge}`;
  const shown = step === 'badge' ? badge : '●'.repeat(pin.length);
  const ready = step === 'badge' ? badge.length >= 3 : pin.length >= 4;

  return (
    <div className="bt-signin">
      <section className="bt-signin__entry" aria-labelledby="bt-signin-title">
        <h1 id="bt-signin-title" className="bt-signin__title">
          {step === 'badge' ? 'Sign in with your badge' : 'Now your PIN'}
        </h1>
        <ol className="bt-signin__steps" aria-label="Steps">
          <li className={step === 'badge' ? 'is-current' : 'is-done'}>
            <span>{step === 'badge' ? '1' : <CheckIcon />}</span> Badge
          </li>
          <li className={step === 'pin' ? 'is-current' : ''}>
            <span>2</span> PIN
          </li>
        </ol>

        {notice && !shownProblem && (
          <p className="bt-signin__notice" role="status">
            {notice}
          </p>
        )}

        <label className="bt-signin__label" htmlFor="bt-signin-value">
          {label}
        </label>
        <output
          id="bt-signin-value"
          className={`bt-signin__value${step === 'pin' ? ' bt-signin__value--pin' : ''}${shownProblem ? ' has-problem' : ''}`}
          aria-live="polite"
          aria-label={step === 'pin' ? `${pin.length} digits typed` : undefined}
        >
          {shown || (
            <span className="bt-signin__placeholder">{step === 'badge' ? 'Type or scan' : 'PIN'}</span>
          )}
        </output>

        <p className="bt-signin__problem" role="alert">
          {shownProblem}
        </p>

        {step === 'pin' && (
          <button
            type="button"
            className="bt-signin__change"
            onClick={() => {
              touched();
              showProblem(null);
              reset();
            }}
          >
            Not badge {badge}? Start again
          </button>
        )}
      </section>

      <section className="bt-signin__pad" aria-label="Keypad">
        <Keypad onDigit={digit} onBackspace={backspace} onClear={clear} disabled={busy} />
        <button
          type="button"
          className="bt-action bt-action--go bt-signin__next"
          onClick={next}
          disabled={busy || !ready}
        >
          {busy
            ? 'Checking…'
            : step === 'badge'
              ? 'Next'
              : offline && onOffline
                ? 'Next: punch offline'
                : 'Sign in'}
          <ArrowRightIcon />
        </button>
      </section>
    </div>
  );
}
