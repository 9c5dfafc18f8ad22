import type { RepairOrderSummary } from '../api/get-repair-orders';
import { formatPhone, lineWords } from '@baytime/shared';
import { formatBookHours, formatDateTime, formatOdometer, groupVin, lineLabel } from '../ro-format';
import './repair-order-print.css';

export interface RepairOrderPrintProps {
  ro: RepairOrderSummary;
  units: 'metric' | 'us' | undefined;
  timeZone: string | undefined;
}

/**
 * What the printer gets from the RO page: the RO on its first page, then a one-page job ticket per
 * open or finished line for the technician's clipboard. Hidden on screen.
 */
export function RepairOrderPrint({ ro, units, timeZone }: RepairOrderPrintProps) {
  const vehicleLine = `${ro.vehicle} · VIN ${groupVin(ro.vin)} · ${formatOdometer(ro.odometer, units)}`;
  const lines = ro.lines.filter((line) => line.status !== 'cancelled');
  return (
    <div className="ro-print" aria-hidden="true">
      <section className="ro-print__page">
        <h1>Repair order {ro.number}</h1>
        <p>
          {ro.customerName}
          {ro.customerPhone && ` · ${formatPhone(ro.customerPhone)}`}
          {ro.customerEmail && ` · ${ro.customerEmail}`}
        </p>
        <p>{vehicleLine}</p>
        <p>
          Written {formatDateTime(ro.createdAt, timeZone)}
          {ro.promisedAt && ` · promised ${formatDateTime(ro.promisedAt, timeZone)}`}
        </p>
        <h2>Concern</h2>
        <p>{ro.concern}</p>
        <table>
          <thead>
            <tr>
              <th>Line</th>
              <th>Concern</th>
              <th>Cause</th>
              <th>Correction</th>
              <th>Book</th>
            </tr>
          </thead>
          <tbody>
            {lines.map((line) => (
              <tr key={line.id}>
                <td>{lineLabel(line)}</td>
                <td>{line.concern}</td>
                <td>{line.cause ?? ''}</td>
                <td>{line.correction ?? ''}</td>
                <td>{formatBookHours(line.bookHours)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
      {lines.map((line) => (
        <section key={line.id} className="ro-print__page ro-print__ticket">
          <h1>
            Job ticket · RO {ro.number} · {lineWords(line.lineNo)}
          </h1>
          <h2>{line.title}</h2>
          <p>{vehicleLine}</p>
          <p>Book hours: {formatBookHours(line.bookHours)}</p>
          <h2>Concern</h2>
          <p>{line.concern}</p>
          <h2>Cause</h2>
          <div className="ro-print__space">{line.cause}</div>
          <h2>Correction</h2>
          <div className="ro-print__space">{line.correction}</div>
          <h2>Notes</h2>
          <div className="ro-print__space ro-print__space--tall" />
        </section>
      ))}
    </div>
  );
}
