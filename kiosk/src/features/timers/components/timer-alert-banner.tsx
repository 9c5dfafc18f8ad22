import { TIMER_KIND_LABELS, type UnitSystem } from '@baytime/shared';
import { BellIcon } from '@/components/icons';
import { clockTime } from '@/lib/format';
import { alertTitle, type TimerAlert } from '../alerts';
import { showTemperature } from '../temperature-entry';
import { useTimerAlerts } from '../hooks/use-timer-alerts';
import './timer-alerts.css';

export interface TimerAlertBannerProps {
  /** Known once the shop's settings were seen: without it the banner leaves the temperature out. */
  units?: UnitSystem;
  timeZone?: string;
}

function detail(alert: TimerAlert, units: UnitSystem | undefined, timeZone: string | undefined): string {
  const when = clockTime(alert.finishedAt, timeZone);
  if (alert.kind === 'set-time') return `${alert.label ?? TIMER_KIND_LABELS['set-time']} · ended ${when}`;
  const word = TIMER_KIND_LABELS[alert.kind];
  const target = alert.targetC !== null && units ? ` to ${showTemperature(alert.targetC, units)}` : '';
  return `${word}${target} · reached ${when}`;
}

/** "Bay 4: target reached", with a chime, on every screen including the keypad. */
export function TimerAlertBanner({ units, timeZone }: TimerAlertBannerProps) {
  const { alerts, dismiss, bayName, needsTapForSound } = useTimerAlerts();
  if (alerts.length === 0 && !needsTapForSound) return null;
  return (
    <div className="bt-timer-alerts">
      {alerts.map((alert) => (
        <div key={alert.timerId} className="bt-timer-alert" role="alert">
          <BellIcon className="bt-timer-alert__icon" />
          <p className="bt-timer-alert__words">
            <strong>{alertTitle(alert, bayName(alert.bayId))}</strong>
            <span>{detail(alert, units, timeZone)}</span>
          </p>
          <button type="button" className="bt-banner-button" onClick={() => dismiss(alert.timerId)}>
            OK
          </button>
        </div>
      ))}
      {needsTapForSound && alerts.length === 0 && (
        <p className="bt-timer-sound" role="status">
          <BellIcon /> Tap the screen once so the kiosk can chime when a timer finishes.
        </p>
      )}
    </div>
  );
}
