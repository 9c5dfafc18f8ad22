import { shortName } from '@baytime/shared';
import { AlertIcon } from '@/components/icons';
import { usePunchNotices } from '../hooks/use-outbox';
import { dismissNotice } from '../punch-queue';
import './punches.css';

/** Punches the server refused, with its reason, until someone taps OK. */
export function PunchNotices({ technicianId }: { technicianId?: number }) {
  const notices = usePunchNotices();
  if (notices.length === 0) return null;
  return (
    <div className="bt-notices">
      {notices.map((notice) => (
        <div key={notice.id} className="bt-notice" role="alert">
          <AlertIcon className="bt-notice__icon" />
          <p className="bt-notice__words">
            <strong>
              Not recorded: {notice.label}
              {notice.technicianId !== technicianId && notice.technicianName
                ? ` (${shortName(notice.technicianName)})`
                : ''}
            </strong>
            <span>{sentence(notice.message)}</span>
          </p>
          <button type="button" className="bt-banner-button" onClick={() => dismissNotice(notice.id)}>
            OK
          </button>
        </div>
      ))}
    </div>
  );
}

function sentence(message: string): string {
  const trimmed = message.trim();
  if (!trimmed) return 'The server did not accept it.';
  const capital = trimmed[0]!.toUpperCase() + trimmed.slice(1);
  return /[.!?]$/.test(capital) ? capital : `${capital}.`;
}
