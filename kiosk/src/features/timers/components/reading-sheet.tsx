import { useState } from 'react';
import { temperatureUnit, type TimerDto, type UnitSystem } from '@baytime/shared';
import { Sheet } from '@/components/sheet';
import { commandProblem } from '@/lib/commands';
import { clockTime } from '@/lib/format';
import {
  TEMPERATURE_ENTRY,
  editEntry,
  readTemperature,
  showTemperature,
  type EntryKey,
} from '../temperature-entry';
import { timerHeadline } from '../timer-status';
import { useLogReading } from '../api/log-reading';
import { EntryKeypad, EntrySend, NumberField } from './number-field';
import './timers.css';

export interface ReadingSheetProps {
  timer: TimerDto;
  context: string;
  units: UnitSystem;
  timeZone?: string;
  onClose: () => void;
}

/** A temperature reading, typed in the shop's unit and sent as °C; the estimate updates at once. */
export function ReadingSheet({ timer, context, units, timeZone, onClose }: ReadingSheetProps) {
  const [text, setText] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const log = useLogReading();
  const unit = temperatureUnit(units);
  const last = timer.readings.at(-1);

  const apply = (key: EntryKey) => {
    setProblem(null);
    log.reset();
    setText((current) => editEntry(current, key, TEMPERATURE_ENTRY));
  };
  const submit = () => {
    const read = readTemperature(text, units, 'the reading');
    if (!read.ok) return setProblem(read.message);
    log.mutate({ timerId: timer.id, tempC: read.value }, { onSuccess: onClose });
  };
  return (
    <Sheet
      title="Log a reading"
      context={context}
      onClose={onClose}
      wide
      footer={
        <EntrySend
          problem={problem ?? (log.error ? commandProblem(log.error) : '')}
          busy={log.isPending}
          onSend={submit}
        >
          {log.isPending ? 'Saving…' : 'Save reading'}
        </EntrySend>
      }
    >
      <div className="bt-entry">
        <div className="bt-entry__fields">
          <p className="bt-entry__facts">
            {timerHeadline(timer, units)}
            {last
              ? ` · last reading ${showTemperature(last.tempC, units)} at ${clockTime(last.at, timeZone)}`
              : ' · first reading'}
          </p>
          <NumberField
            label={`Temperature now (${unit})`}
            text={text}
            unit={unit}
            active
            invalid={problem !== null}
            onSelect={() => undefined}
          />
        </div>
        <EntryKeypad apply={apply} rules={TEMPERATURE_ENTRY} onEnter={submit} disabled={log.isPending} />
      </div>
    </Sheet>
  );
}
