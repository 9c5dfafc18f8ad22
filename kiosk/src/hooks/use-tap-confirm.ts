import { useEffect, useState } from 'react';
import { createTapConfirm, type TapConfirm, type TapConfirmState } from '@/lib/tap-confirm';

/**
 * A button that asks "Tap again" before it acts: `armed` says when to show the question, `tap`
 * answers whether this tap confirms. Every kiosk confirm uses it, so a double tap never confirms.
 */
export function useTapConfirm(): { armed: boolean; tap: () => boolean; reset: () => void } {
  const [state, setState] = useState<TapConfirmState>('idle');
  const [confirm] = useState<TapConfirm>(() => createTapConfirm(setState));
  useEffect(() => () => confirm.reset(), [confirm]);
  return { armed: state === 'armed', tap: confirm.tap, reset: confirm.reset };
}
