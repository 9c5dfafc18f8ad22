import './idle-warning.css';

/** The countdown before an idle sign-out; any touch keeps the technician signed in. */
export function IdleWarning({ secondsLeft }: { secondsLeft: number }) {
  return (
    <div className="bt-idle" role="alert">
      <span className="bt-idle__count">{secondsLeft}</span>
      <span>Signing you out for the next person. Tap anywhere to stay.</span>
    </div>
  );
}
