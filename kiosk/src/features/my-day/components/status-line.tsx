import { CupIcon, DoorOutIcon, MealIcon, MeaningGlyph, WrenchIcon } from '@/components/icons';
import type { DayView } from '../project-day';
import type { StatusText } from '../status-text';

export interface StatusLineProps {
  view: DayView;
  text: StatusText;
}

const IdleIcon = () => <MeaningGlyph name="idle" />;

export function StatusLine({ view, text }: StatusLineProps) {
  const { status, breakKind } = view.shift;
  const working = status === 'on-shift' && view.lines.some((l) => l.clockedOn);
  const tone = status === 'off' ? 'off' : status === 'on-break' ? 'break' : working ? 'working' : 'idle';
  const Icon =
    status === 'off'
      ? DoorOutIcon
      : status === 'on-break'
        ? breakKind === 'rest'
          ? CupIcon
          : MealIcon
        : working
          ? WrenchIcon
          : IdleIcon;
  return (
    <section className={`bt-status bt-status--${tone}`} aria-live="polite" aria-label="Your status">
      <span className="bt-status__icon" aria-hidden="true">
        <Icon />
      </span>
      <div className="bt-status__words">
        <p className="bt-status__headline">{text.headline}</p>
        <p className="bt-status__detail">
          {text.detail}
          {view.shiftPending && <span className="bt-pending-tag">Sending…</span>}
        </p>
      </div>
    </section>
  );
}
