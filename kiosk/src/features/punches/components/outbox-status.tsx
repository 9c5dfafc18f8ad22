import { shortName } from '@baytime/shared';
import { UploadIcon } from '@/components/icons';
import { useOutboxEntries } from '../hooks/use-outbox';
import { kick, outbox } from '../punch-queue';
import './punches.css';

/** "3 punches waiting to be sent": the tablet still holds them, nothing is lost. */
export function OutboxStatus() {
  const entries = useOutboxEntries();
  if (entries.length === 0) return null;

  const waitingFor = [
    ...new Set(
      entries.filter((e) => e.waitingForSignIn).map((e) => shortName(e.technicianName) || 'a technician'),
    ),
  ];
  const lastError = entries.find((e) => e.lastError && !e.waitingForSignIn)?.lastError;
  const sendNow = () => {
    outbox.retryNow(Date.now());
    void kick();
  };

  return (
    <div className="bt-outbox" role="status">
      <UploadIcon className="bt-outbox__icon" />
      <div className="bt-outbox__words">
        <strong>
          {entries.length === 1
            ? '1 punch waiting to be sent'
            : `${entries.length} punches waiting to be sent`}
        </strong>
        <span>
          Saved on this tablet: they go as soon as the server answers.
          {lastError ? ` Last try: ${lastError}.` : ''}
          {waitingFor.length > 0 ? ` Some wait for ${waitingFor.join(', ')} to sign in again.` : ''}
        </span>
      </div>
      <button type="button" className="bt-banner-button" onClick={sendNow}>
        Send now
      </button>
    </div>
  );
}
