/** A confirming tap counts only this long after the first: a gloved double tap bounces within it. */
export const CONFIRM_ARM_MS = 600;
/** How long the armed button waits for the confirming tap before it falls back. */
export const CONFIRM_WINDOW_MS = 4000;

/** `idle`: nothing asked; `arming`: first tap seen, too soon to confirm; `armed`: a tap now confirms. */
export type TapConfirmState = 'idle' | 'arming' | 'armed';

export interface TapConfirm {
  /** A tap on the button: true when it confirms the action. */
  tap(): boolean;
  state(): TapConfirmState;
  reset(): void;
}

/**
 * The "tap again" rule of every kiosk confirm: the first tap arms the button after `armMs`, a tap
 * before then is ignored, a tap while armed confirms, and the button falls back after `windowMs`.
 */
export function createTapConfirm(
  onChange: (state: TapConfirmState) => void,
  { armMs = CONFIRM_ARM_MS, windowMs = CONFIRM_WINDOW_MS } = {},
): TapConfirm {
  let state: TapConfirmState = 'idle';
  let timer: ReturnType<typeof setTimeout> | undefined;
  const go = (next: TapConfirmState) => {
    state = next;
    onChange(next);
  };
  const reset = () => {
    clearTimeout(timer);
    timer = undefined;
    if (state !== 'idle') go('idle');
  };
  return {
    tap() {
      if (state === 'arming') return false;
      if (state === 'armed') {
        reset();
        return true;
      }
      go('arming');
      timer = setTimeout(() => {
        go('armed');
        timer = setTimeout(reset, windowMs);
      }, armMs);
      return false;
    },
    state: () => state,
    reset,
  };
}
