import { useEffect, useId, useRef, type ReactNode } from 'react';
import { createPortal } from 'react-dom';
import './sheet.css';

export interface SheetProps {
  title: string;
  /** A line above the title naming what the sheet acts on: "RO 4521 · line 1 · Bay 1". */
  context?: string;
  onClose: () => void;
  /** The close button's word; "Back" while inside a step. */
  closeLabel?: string;
  onBack?: () => void;
  wide?: boolean;
  /** The sheet's buttons and its problem, kept in view below the body, which scrolls on a short screen. */
  footer?: ReactNode;
  children: ReactNode;
}

let openSheets = 0;

/**
 * A modal panel over the screen, for choices that need the whole of a gloved hand's attention.
 * Escape and the close button leave it; focus goes in on open and back where it was on close.
 */
export function Sheet({
  title,
  context,
  onClose,
  closeLabel = 'Cancel',
  onBack,
  wide,
  footer,
  children,
}: SheetProps) {
  const titleId = useId();
  const panel = useRef<HTMLDivElement>(null);
  const close = useRef(onClose);
  const back = useRef(onBack);
  useEffect(() => {
    close.current = onClose;
    back.current = onBack;
  });

  useEffect(() => {
    const before = document.activeElement instanceof HTMLElement ? document.activeElement : null;
    // The screen behind takes no taps or focus while the sheet is up.
    const app = document.querySelector('.bt-app');
    openSheets += 1;
    app?.setAttribute('inert', '');
    panel.current?.focus();
    const onKey = (event: KeyboardEvent) => {
      if (event.key !== 'Escape') return;
      event.preventDefault();
      (back.current ?? close.current)();
    };
    window.addEventListener('keydown', onKey);
    return () => {
      window.removeEventListener('keydown', onKey);
      openSheets -= 1;
      if (openSheets === 0) app?.removeAttribute('inert');
      if (before?.isConnected) before.focus();
    };
  }, []);

  return createPortal(
    <div className="bt-sheet-backdrop">
      <div
        ref={panel}
        className={`bt-sheet${wide ? ' bt-sheet--wide' : ''}`}
        role="dialog"
        aria-modal="true"
        aria-labelledby={titleId}
        tabIndex={-1}
      >
        <header className="bt-sheet__head">
          {onBack && (
            <button type="button" className="bt-sheet__close" onClick={onBack}>
              Back
            </button>
          )}
          <div className="bt-sheet__titles">
            {context && <p className="bt-sheet__context">{context}</p>}
            <h2 id={titleId} className="bt-sheet__title">
              {title}
            </h2>
          </div>
          <button type="button" className="bt-sheet__close" onClick={onClose}>
            {closeLabel}
          </button>
        </header>
        <div className="bt-sheet__body">{children}</div>
        {footer && <div className="bt-sheet__foot">{footer}</div>}
      </div>
    </div>,
    document.querySelector('.bt-fluent-root') ?? document.body,
  );
}

/** A problem under a sheet's buttons: the server's refusal or a lost link, in plain words. */
export function SheetProblem({ children }: { children: ReactNode }) {
  if (!children) return null;
  return (
    <p className="bt-sheet__problem" role="alert">
      {children}
    </p>
  );
}
