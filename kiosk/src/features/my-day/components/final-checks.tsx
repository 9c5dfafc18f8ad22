import { BAY_STATE_WORDS, type MyFinalCheck } from '@baytime/shared';
import { MeaningGlyph } from '@/components/icons';
import { commandProblem } from '@/lib/commands';
import { useRecordFinalCheck } from '../api/record-final-check';

/** Vehicles this technician worked on that wait in `check`: one tap records the road test or final look. */
export function FinalChecks({ checks }: { checks: readonly MyFinalCheck[] }) {
  const record = useRecordFinalCheck();
  if (checks.length === 0) return null;
  return (
    <section className="bt-checks" aria-labelledby="bt-checks-title">
      <h2 id="bt-checks-title" className="bt-day__heading">
        <span>{BAY_STATE_WORDS.check}</span>
      </h2>
      {checks.map((check) => (
        <button
          key={check.bayId}
          type="button"
          className="bt-action bt-action--go bt-action--two-line"
          disabled={record.isPending}
          onClick={() => record.mutate(check.bayId)}
        >
          <MeaningGlyph name="final-check-next" />
          <span>
            {BAY_STATE_WORDS.check} done: {check.bayName}
            {/* Two lines at most, then an ellipsis: a vehicle name may run to a hundred characters. */}
            <small data-shortened>
              RO {check.repairOrderNumber} · {check.vehicle}
            </small>
          </span>
        </button>
      ))}
      {record.isError && (
        <p className="bt-line__problem" role="alert">
          {commandProblem(record.error)}
        </p>
      )}
    </section>
  );
}
