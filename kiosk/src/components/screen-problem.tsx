import { AlertIcon } from './icons';

export interface ScreenProblemProps {
  title: string;
  message: string;
  onRetry?: () => void;
  retryLabel?: string;
  children?: React.ReactNode;
}

/** A screen that could not be shown says so, with a way forward. */
export function ScreenProblem({
  title,
  message,
  onRetry,
  retryLabel = 'Try again',
  children,
}: ScreenProblemProps) {
  return (
    <div className="bt-problem" role="alert">
      <AlertIcon className="bt-problem__icon" />
      <h1 className="bt-problem__title">{title}</h1>
      <p className="bt-problem__message">{message}</p>
      <div className="bt-problem__actions">
        {onRetry && (
          <button type="button" className="bt-action bt-action--go" onClick={onRetry}>
            {retryLabel}
          </button>
        )}
        {children}
      </div>
    </div>
  );
}
