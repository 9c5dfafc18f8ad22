import { describe, expect, it } from 'vitest';
import type { OpeningHours } from '../shop/shop.schema.js';
import { addOpenHours, forecastTechnicianQueue, type QueueForecastInput } from './forecast.js';

// America/Chicago: CST is UTC−6, CDT is UTC−5. US DST 2026 (Energy Policy Act of 2005, Pub. L. 109-58 §110): clocks
// go forward on Sunday 8 March and back on Sunday 1 November, at 2 a.m. local.
const ZONE = 'America/Chicago';
const day = { open: '07:30', close: '17:30' };
// Sunday first.
const WEEKDAYS: OpeningHours = [null, day, day, day, day, day, null];
const WITH_SATURDAY_MORNING: OpeningHours = [
  null,
  day,
  day,
  day,
  day,
  day,
  { open: '08:00', close: '12:00' },
];
const ALL_DAY: OpeningHours = Array.from({ length: 7 }, () => ({ open: '00:00', close: '23:59' }));

const utc = (iso: string) => new Date(`${iso}Z`);

function forecast(input: Partial<QueueForecastInput> & Pick<QueueForecastInput, 'lines' | 'now'>) {
  const forecasts = forecastTechnicianQueue({
    efficiency: 1,
    openingHours: WEEKDAYS,
    timeZone: ZONE,
    ...input,
  });
  if (!forecasts) throw new Error('No opening hours in this test');
  return forecasts;
}

describe(forecastTechnicianQueue.name, () => {
  it('divides book hours by efficiency', () => {
    // 2.0 h at 125 % = 2.0 ÷ 1.25 = 1.6 h = 1 h 36 min. Tue 3 Mar 09:00 CST (15:00Z) → 10:36 CST (16:36Z).
    const [sut] = forecast({
      lines: [{ id: 1, remainingBookHours: 2 }],
      efficiency: 1.25,
      now: utc('2026-03-03T15:00'),
    });
    expect(sut).toEqual({
      id: 1,
      workHours: 1.6,
      startAt: utc('2026-03-03T15:00'),
      finishAt: utc('2026-03-03T16:36'),
      late: false,
    });
  });

  it('queues lines one after another and flags the late ones', () => {
    // Efficiency 80 %: A 2.0 ÷ 0.8 = 2.5 h, 09:00 → 11:30; B 4.0 ÷ 0.8 = 5 h, 11:30 → 16:30 (promised
    // 16:00: late); C 1.6 ÷ 0.8 = 2 h, 1 h to the 17:30 close, 1 h from Wed 07:30 → 08:30 (promised
    // exactly then: on time). Times CST = UTC−6.
    const sut = forecast({
      efficiency: 0.8,
      now: utc('2026-03-03T15:00'),
      lines: [
        { id: 1, remainingBookHours: 2, promisedAt: '2026-03-03T12:00:00-06:00' },
        { id: 2, remainingBookHours: 4, promisedAt: new Date('2026-03-03T16:00:00-06:00') },
        { id: 3, remainingBookHours: 1.6, promisedAt: '2026-03-04T08:30:00-06:00' },
        { id: 4, remainingBookHours: 0.5, promisedAt: null },
      ],
    });
    expect(sut.map(({ id, startAt, finishAt, late }) => ({ id, startAt, finishAt, late }))).toEqual([
      { id: 1, startAt: utc('2026-03-03T15:00'), finishAt: utc('2026-03-03T17:30'), late: false },
      { id: 2, startAt: utc('2026-03-03T17:30'), finishAt: utc('2026-03-03T22:30'), late: true },
      { id: 3, startAt: utc('2026-03-03T22:30'), finishAt: utc('2026-03-04T14:30'), late: false },
      // 0.5 ÷ 0.8 = 0.625 h = 37.5 min after 08:30.
      { id: 4, startAt: utc('2026-03-04T14:30'), finishAt: utc('2026-03-04T15:07:30'), late: false },
    ]);
  });

  it('carries a line that does not fit today into the next working day', () => {
    // Starts 16:30 with 2 h left, closes 17:30: 1 h today, 1 h from 07:30 tomorrow → 08:30 CST.
    const [sut] = forecast({ lines: [{ id: 1, remainingBookHours: 2 }], now: utc('2026-03-03T22:30') });
    expect(sut!.finishAt).toEqual(utc('2026-03-04T14:30'));
  });

  it('finishes at the close when the work fits exactly, and starts the next line at the next opening', () => {
    // 15:30 + 2 h = 17:30 CST; the next line waits for Wed 07:30 CST (13:30Z).
    const sut = forecast({
      lines: [
        { id: 1, remainingBookHours: 2 },
        { id: 2, remainingBookHours: 1 },
      ],
      now: utc('2026-03-03T21:30'),
    });
    expect(sut[0]!.finishAt).toEqual(utc('2026-03-03T23:30'));
    expect(sut[1]).toMatchObject({ startAt: utc('2026-03-04T13:30'), finishAt: utc('2026-03-04T14:30') });
  });

  it('starts at the next opening when the shop is closed now', () => {
    // Tue 06:00 CST → 07:30; Tue 18:00 CST → Wed 07:30; Sun 1 Mar 10:00 CST → Mon 2 Mar 07:30 (13:30Z).
    const startAt = (now: string) =>
      forecast({ lines: [{ id: 1, remainingBookHours: 1 }], now: utc(now) })[0]!.startAt;
    expect(startAt('2026-03-03T12:00')).toEqual(utc('2026-03-03T13:30'));
    expect(startAt('2026-03-04T00:00')).toEqual(utc('2026-03-04T13:30'));
    expect(startAt('2026-03-01T16:00')).toEqual(utc('2026-03-02T13:30'));
  });

  it('skips the weekend', () => {
    // Fri 27 Feb 16:00 CST, 3 h: 1.5 h to the 17:30 close; Sat and Sun closed; 1.5 h from Mon 2 Mar 07:30
    // → 09:00 CST (15:00Z). With Saturday 08:00–12:00 open: 1.5 h from Sat 08:00 → 09:30 CST (15:30Z).
    const lines = [{ id: 1, remainingBookHours: 3 }];
    const now = utc('2026-02-27T22:00');
    expect(forecast({ lines, now })[0]!.finishAt).toEqual(utc('2026-03-02T15:00'));
    expect(forecast({ lines, now, openingHours: WITH_SATURDAY_MORNING })[0]!.finishAt).toEqual(
      utc('2026-02-28T15:30'),
    );
  });

  it('follows the shop clock across the spring-forward weekend', () => {
    // Fri 6 Mar 17:00 CST (23:00Z), 1 h: 0.5 h to 17:30; Mon 9 Mar opens 07:30 CDT (12:30Z, no longer
    // 13:30Z) → 08:00 CDT = 13:00Z.
    const [sut] = forecast({ lines: [{ id: 1, remainingBookHours: 1 }], now: utc('2026-03-06T23:00') });
    expect(sut!.finishAt).toEqual(utc('2026-03-09T13:00'));
  });

  it('counts the real length of a DST day', () => {
    // Sun 8 Mar 00:00 CST (06:00Z) to 23:59 CDT (04:59Z) is 22 h 59 min of real time; a 23 h line has
    // 1 min left for Mon 00:00 CDT (05:00Z) → 05:01Z.
    const spring = forecast({
      lines: [{ id: 1, remainingBookHours: 23 }],
      openingHours: ALL_DAY,
      now: utc('2026-03-08T06:00'),
    });
    expect(spring[0]!.finishAt).toEqual(utc('2026-03-09T05:01'));
    // Sun 1 Nov 00:00 CDT (05:00Z) to 23:59 CST (05:59Z next day) is 24 h 59 min: 24 h ends 23:00 CST the
    // same local day (05:00Z).
    const fall = forecast({
      lines: [{ id: 1, remainingBookHours: 24 }],
      openingHours: ALL_DAY,
      now: utc('2026-11-01T05:00'),
    });
    expect(fall[0]!.finishAt).toEqual(utc('2026-11-02T05:00'));
  });

  it('treats a new tech (no efficiency yet) as 100 %', () => {
    for (const efficiency of [null, 0, -1, Number.NaN]) {
      const [sut] = forecast({
        lines: [{ id: 1, remainingBookHours: 1.5 }],
        efficiency,
        now: utc('2026-03-03T15:00'),
      });
      expect(sut).toMatchObject({ workHours: 1.5, finishAt: utc('2026-03-03T16:30') });
    }
  });

  it('spreads a long line over several days and ignores negative remaining hours', () => {
    // Mon 2 Mar 07:30, 15 h: 10 h Monday, 5 h from Tue 07:30 → 12:30 CST (18:30Z).
    const sut = forecast({
      lines: [
        { id: 1, remainingBookHours: 15 },
        { id: 2, remainingBookHours: -0.4 },
      ],
      now: utc('2026-03-02T13:30'),
    });
    expect(sut[0]!.finishAt).toEqual(utc('2026-03-03T18:30'));
    expect(sut[1]).toMatchObject({
      workHours: 0,
      startAt: utc('2026-03-03T18:30'),
      finishAt: utc('2026-03-03T18:30'),
    });
  });

  it('says there is no forecast for a shop with no open day', () => {
    const closed = forecastTechnicianQueue({
      lines: [{ id: 1, remainingBookHours: 1 }],
      efficiency: 1,
      openingHours: Array(7).fill(null),
      timeZone: ZONE,
      now: utc('2026-03-03T15:00'),
    });
    expect(closed).toBeNull();
  });

  it('bounds an efficiency that is tiny or huge', () => {
    // 1e-300 counts as the 25 % floor: 1 h of book time takes 4 h, Tue 09:00 CST → 13:00 CST (19:00Z).
    // 1e300 counts as the 400 % ceiling: 1 h takes 15 min → 09:15 CST (15:15Z).
    const finish = (efficiency: number) =>
      forecast({ lines: [{ id: 1, remainingBookHours: 1 }], efficiency, now: utc('2026-03-03T15:00') })[0]!
        .finishAt;
    expect(finish(1e-300)).toEqual(utc('2026-03-03T19:00'));
    expect(finish(1e300)).toEqual(utc('2026-03-03T15:15'));
  });

  it('works the next line while a line waits for parts, then the parts line once they are in', () => {
    // Tue 3 Mar, CST = UTC−6, 100 %. Parts line P (1 h) due 10:00; A (2 h) can start now at 09:00:
    // A 09:00–11:00, then P (its parts in since 10:00) 11:00–12:00; promised 11:30, so late.
    const sut = forecast({
      now: utc('2026-03-03T15:00'),
      lines: [
        {
          id: 1,
          remainingBookHours: 1,
          notBefore: '2026-03-03T10:00:00-06:00',
          promisedAt: utc('2026-03-03T17:30'),
        },
        { id: 2, remainingBookHours: 2, notBefore: null },
      ],
    });
    expect(sut.map(({ id, startAt, finishAt, late }) => ({ id, startAt, finishAt, late }))).toEqual([
      { id: 2, startAt: utc('2026-03-03T15:00'), finishAt: utc('2026-03-03T17:00'), late: false },
      { id: 1, startAt: utc('2026-03-03T17:00'), finishAt: utc('2026-03-03T18:00'), late: true },
    ]);
  });

  it('waits for the earliest parts when no line can start', () => {
    // 09:00 CST; P1 (1 h) due 14:00, P2 (1 h) due 11:00: idle until 11:00, P2 11:00–12:00, idle
    // again until 14:00, P1 14:00–15:00.
    const sut = forecast({
      now: utc('2026-03-03T15:00'),
      lines: [
        { id: 1, remainingBookHours: 1, notBefore: utc('2026-03-03T20:00') },
        { id: 2, remainingBookHours: 1, notBefore: utc('2026-03-03T17:00') },
      ],
    });
    expect(sut.map(({ id, startAt, finishAt }) => ({ id, startAt, finishAt }))).toEqual([
      { id: 2, startAt: utc('2026-03-03T17:00'), finishAt: utc('2026-03-03T18:00') },
      { id: 1, startAt: utc('2026-03-03T20:00'), finishAt: utc('2026-03-03T21:00') },
    ]);
  });

  it('starts parts due after the close at the next opening, and ignores parts already in', () => {
    // Parts due Tue 18:00 CST, after the 17:30 close: 1.5 h from Wed 07:30 → 09:00 CST (15:00Z).
    const [late] = forecast({
      now: utc('2026-03-03T15:00'),
      lines: [{ id: 1, remainingBookHours: 1.5, notBefore: utc('2026-03-04T00:00') }],
    });
    expect([late!.startAt, late!.finishAt]).toEqual([utc('2026-03-04T13:30'), utc('2026-03-04T15:00')]);
    // Parts due 08:00, it is 09:00 already: it starts now, 09:00–10:30.
    const [arrived] = forecast({
      now: utc('2026-03-03T15:00'),
      lines: [{ id: 1, remainingBookHours: 1.5, notBefore: utc('2026-03-03T14:00') }],
    });
    expect([arrived!.startAt, arrived!.finishAt]).toEqual([utc('2026-03-03T15:00'), utc('2026-03-03T16:30')]);
  });

  it('returns nothing for an empty queue', () => {
    expect(forecast({ lines: [], now: utc('2026-03-03T15:00') })).toEqual([]);
  });
});

describe(addOpenHours.name, () => {
  it('adds shop time only', () => {
    // Tue 17:00 CST + 1 h: 0.5 h to the close, 0.5 h from Wed 07:30 → 08:00 CST (14:00Z).
    expect(addOpenHours(utc('2026-03-03T23:00'), 1, WEEKDAYS, ZONE)).toEqual(utc('2026-03-04T14:00'));
    // Europe/Berlin, Tue 3 Mar 16:00 CET (15:00Z) + 2 h: 1.5 h to 17:30, 0.5 h from Wed 07:30 → 08:00 CET (07:00Z).
    expect(addOpenHours(utc('2026-03-03T15:00'), 2, WEEKDAYS, 'Europe/Berlin')).toEqual(
      utc('2026-03-04T07:00'),
    );
  });
});

describe(`${addOpenHours.name} beyond a day shop`, () => {
  it('works through the night in a shop open 22:00–06:00', () => {
    const NIGHTS: OpeningHours = Array.from({ length: 7 }, () => ({ open: '22:00', close: '06:00' }));
    // Tue 3 Mar 23:00 CST (Wed 05:00Z) + 3 h → Wed 02:00 CST (08:00Z).
    expect(addOpenHours(utc('2026-03-04T05:00'), 3, NIGHTS, ZONE)).toEqual(utc('2026-03-04T08:00'));
    // + 10 h: 7 h to Wed 06:00, then 3 h from Wed 22:00 → Thu 01:00 CST (07:00Z).
    expect(addOpenHours(utc('2026-03-04T05:00'), 10, NIGHTS, ZONE)).toEqual(utc('2026-03-05T07:00'));
    // Closed at noon: the next opening is 22:00 CST the same day (04:00Z next day).
    expect(addOpenHours(utc('2026-03-03T18:00'), 0, NIGHTS, ZONE)).toEqual(utc('2026-03-04T04:00'));
  });

  it('treats an open time equal to the close as round the clock', () => {
    const ROUND_THE_CLOCK: OpeningHours = Array.from({ length: 7 }, () => ({
      open: '08:00',
      close: '08:00',
    }));
    // Tue 3 Mar 09:00 CST + 50 h, never closed → Thu 5 Mar 11:00 CST (17:00Z).
    expect(addOpenHours(utc('2026-03-03T15:00'), 50, ROUND_THE_CLOCK, ZONE)).toEqual(utc('2026-03-05T17:00'));
  });

  it('skips whole weeks at once', () => {
    // 07:30–17:30 on weekdays is 50 h a week. From Mon 2 Mar 07:30 CST, 1,000 h is 20 weeks exactly: it
    // ends at the close of the 20th Friday, 6 Mar + 19 weeks = Fri 17 Jul 17:30 CDT (22:30Z).
    expect(addOpenHours(utc('2026-03-02T13:30'), 1000, WEEKDAYS, ZONE)).toEqual(utc('2026-07-17T22:30'));
    // One hour more is the next Monday's first hour: Mon 20 Jul 08:30 CDT (13:30Z).
    expect(addOpenHours(utc('2026-03-02T13:30'), 1001, WEEKDAYS, ZONE)).toEqual(utc('2026-07-20T13:30'));
  });

  it('answers for the hours and the zone it is given, from the same local day one call after another', () => {
    // Fri 6 Mar 16:00 CST (22:00Z) + 2 h: 1.5 h to the close, then 0.5 h from Mon 9 Mar 07:30 CDT (DST
    // since Sunday) → 08:00 CDT (13:00Z).
    expect(addOpenHours(utc('2026-03-06T22:00'), 2, WEEKDAYS, ZONE)).toEqual(utc('2026-03-09T13:00'));
    // Open Saturday morning: 0.5 h from Sat 7 Mar 08:00 CST → 08:30 CST (14:30Z).
    expect(addOpenHours(utc('2026-03-06T22:00'), 2, WITH_SATURDAY_MORNING, ZONE)).toEqual(
      utc('2026-03-07T14:30'),
    );
    // The same instant is Fri 23:00 CET in Berlin (DST from 29 Mar): closed, so Mon 07:30 CET + 2 h →
    // 09:30 CET (08:30Z).
    expect(addOpenHours(utc('2026-03-06T22:00'), 2, WEEKDAYS, 'Europe/Berlin')).toEqual(
      utc('2026-03-09T08:30'),
    );
  });

  it('has no answer for a shop that never opens', () => {
    expect(addOpenHours(utc('2026-03-03T15:00'), 1, Array(7).fill(null), ZONE)).toBeNull();
  });

  it('refuses hours that are no number instead of counting them down for ever', () => {
    // NaN hours (a pace of 0 ÷ 0 clocked hours) once looped here for good, and the server with it.
    for (const hours of [Infinity, -Infinity, NaN])
      expect(() => addOpenHours(utc('2026-03-03T15:00'), hours, WEEKDAYS, ZONE)).toThrow(RangeError);
  });
});
