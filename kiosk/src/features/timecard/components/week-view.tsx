import { Link } from 'react-router';
import type { Timecard, TimecardTotals } from '@baytime/shared';
import { AlertIcon, ArrowLeftIcon, ArrowRightIcon } from '@/components/icons';
import { clockTime, formatHours } from '@/lib/format';
import { buildWeekView, payableNote, weekFigures, type PunchRow } from '../timecard-view';
import './week.css';

function Totals({ totals, compact }: { totals: TimecardTotals; compact?: boolean }) {
  const items: [string, number][] = [
    ['At work', totals.attendanceSeconds],
    ['On jobs', totals.clockedSeconds],
    ['Not on a job', totals.idleSeconds],
  ];
  if (!compact || totals.mealBreakSeconds > 0) items.push(['Meal breaks', totals.mealBreakSeconds]);
  if (!compact || totals.restBreakSeconds > 0) items.push(['Rest breaks', totals.restBreakSeconds]);
  return (
    <dl className={`bt-week-totals${compact ? ' bt-week-totals--compact' : ''}`}>
      {items.map(([label, seconds]) => (
        <div key={label}>
          <dt>{label}</dt>
          <dd>{formatHours(seconds)}</dd>
        </div>
      ))}
    </dl>
  );
}

function Punch({ row }: { row: PunchRow }) {
  return (
    <li
      className={`bt-punch${row.supersededBecause ? ' is-superseded' : ''}${row.notCounted ? ' is-not-counted' : ''}`}
    >
      <span className="bt-punch__time">{row.supersededBecause ? <s>{row.time}</s> : row.time}</span>
      <span className="bt-punch__what">
        {row.supersededBecause ? <s>{row.words}</s> : <strong>{row.words}</strong>}
        {row.detail && <span className="bt-punch__detail">{row.detail}</span>}
        {row.supersededBecause && (
          <span className="bt-punch__note">
            {row.takenOut ? 'Not counted any more' : 'Replaced by a correction'}: {row.supersededBecause}
          </span>
        )}
        {row.note && (
          <span className="bt-punch__note">
            {row.note.kind === 'correction' ? 'Correction' : 'Added'} by {row.note.by}
            {row.note.reason ? `: ${row.note.reason}` : ''}
          </span>
        )}
        {row.notCounted && <span className="bt-punch__warn">Not counted: {row.notCounted}</span>}
      </span>
    </li>
  );
}

export interface WeekViewProps {
  card: Timecard;
  previousHref: string;
  /** Null for the current week: there is nothing after it yet. */
  nextHref: string | null;
  /** A refetch failed: what is shown is older. */
  stale?: boolean;
}

/** A technician's own week: each day's hours and punches, struck-through corrections, flags. */
export function WeekView({ card, previousHref, nextHref, stale }: WeekViewProps) {
  const view = buildWeekView(card);
  const payable = payableNote(card.summary.pay);
  return (
    <div className="bt-week">
      <header className="bt-week-page__head">
        <Link className="bt-week-page__step" to={previousHref} replace>
          <ArrowLeftIcon /> Week before
        </Link>
        <h1 className="bt-week-page__title">
          My week
          <small>
            {card.weekName} · {view.range}
            {stale ? ' · could not refresh' : ''}
          </small>
        </h1>
        {nextHref ? (
          <Link className="bt-week-page__step" to={nextHref} replace>
            Week after <ArrowRightIcon />
          </Link>
        ) : (
          <span className="bt-week-page__step is-disabled" aria-hidden="true" />
        )}
      </header>

      <section className="bt-week__summary" aria-label="Week totals">
        <Totals totals={card.totals} />
      </section>

      <section className="bt-week__summary bt-week__figures" aria-label="In the reports">
        <dl className="bt-week-totals">
          {weekFigures(card).map(({ label, value }) => (
            <div key={label}>
              <dt>{label}</dt>
              <dd>{value}</dd>
            </div>
          ))}
        </dl>
        {payable && (
          <p className="bt-week__payable" role="note">
            <AlertIcon />
            <span>{payable}</span>
          </p>
        )}
        <p className="bt-week__pay-note">
          {card.summary.pay
            ? `${card.summary.caution} Flagged hours count in the week the line is finished. Ask the foreman about pay or a punch that looks wrong.`
            : 'Flagged hours count in the week the line is finished. Pay is worked out by the office: ask the foreman about pay or a punch that looks wrong.'}
        </p>
      </section>

      {card.held.some((held) => held.review === 'pending') && (
        <section className="bt-week__flags" aria-label="Waiting for the foreman">
          <AlertIcon />
          <ul>
            {card.held
              .filter((held) => held.review === 'pending')
              .map((held) => (
                <li key={held.id}>
                  A punch sent late ({clockTime(held.at, card.timeZone)}) waits for the foreman: it is not
                  counted until the foreman accepts it.
                </li>
              ))}
          </ul>
        </section>
      )}

      {card.flags.length > 0 && (
        <section className="bt-week__flags" aria-label="To look at">
          <AlertIcon />
          <ul>
            {card.flags.map((flag) => (
              <li key={flag}>{flag}</li>
            ))}
          </ul>
        </section>
      )}

      {view.days.length === 0 && <p className="bt-week__empty">No time recorded this week.</p>}

      {view.days.map((day) => (
        <section key={day.day} className="bt-week-day" aria-labelledby={`day-${day.day}`}>
          <header className="bt-week-day__head">
            <h3 id={`day-${day.day}`}>{day.label}</h3>
            <Totals totals={day} compact />
          </header>
          {day.punches.length > 0 ? (
            <ol className="bt-punches">
              {day.punches.map((row) => (
                <Punch key={row.id} row={row} />
              ))}
            </ol>
          ) : (
            <p className="bt-week-day__none">No punches on this day.</p>
          )}
        </section>
      ))}

      {view.emptyDays.length > 0 && view.days.length > 0 && (
        <p className="bt-week__empty">No time on {view.emptyDays.join(', ')}.</p>
      )}
    </div>
  );
}
