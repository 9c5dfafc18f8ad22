import type { MyAnsweredFinding, MyJobLine } from '@baytime/shared';
import { useAnsweredFindings } from '../hooks/use-finding-answer-notices';

export interface FindingAnswerNoticesProps {
  lines: readonly MyJobLine[];
  answered: readonly MyAnsweredFinding[];
}

/** What the customer answered to the findings on the technician's lines, until they tap OK. */
export function FindingAnswerNotices({ lines, answered }: FindingAnswerNoticesProps) {
  const { notices, dismiss } = useAnsweredFindings(lines, answered);
  if (notices.length === 0) return null;
  return (
    <div className="bt-answer-notices">
      {notices.map((notice) => (
        <div key={notice.findingId} className="bt-parts-in bt-answer-notice" role="status">
          <p>{notice.text}</p>
          <button type="button" className="bt-banner-button" onClick={() => dismiss(notice.findingId)}>
            OK
          </button>
        </div>
      ))}
    </div>
  );
}
