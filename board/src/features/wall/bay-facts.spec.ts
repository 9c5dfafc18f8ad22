import { describe, expect, it } from 'vitest';
import type { BoardBay } from '@baytime/shared';
import {
  bandNote,
  bayFacts,
  clockedBar,
  countdownFact,
  holdFacts,
  pickLines,
  techsWords,
  wallVehicle,
  type BayFact,
} from './bay-facts';

const now = Date.parse('2026-03-02T15:00:00Z');
const bay = (patch: Partial<BoardBay>): BoardBay => ({
  id: 1,
  name: 'Bay 1',
  state: 'working',
  holdReason: null,
  heldSince: null,
  partsDueAt: null,
  vehicle: '2019 Norden Kestrel',
  repairOrder: { id: 1, number: '4821' },
  jobLine: { id: 2, lineNo: 1, title: 'Brake pads', status: 'working' },
  technicians: [{ id: 3, name: 'Dana O.' }],
  clockedSeconds: 0,
  bookSeconds: 5400,
  clockRunning: true,
  timer: null,
  ...patch,
});

describe(clockedBar.name, () => {
  it('fills up to book and marks time past it as its own segment', () => {
    expect(clockedBar(2700, 5400)).toEqual({ withinBook: 0.5, overBook: 0, bookMark: 1, overSeconds: 0 });
    const over = clockedBar(6000, 4800);
    expect(over?.withinBook).toBeCloseTo(0.8);
    expect(over?.overBook).toBeCloseTo(0.2);
    expect(over?.bookMark).toBeCloseTo(0.8);
    expect(over?.overSeconds).toBe(1200);
    expect(clockedBar(100, 0)).toBeNull();
  });
});

describe(bayFacts.name, () => {
  it('tells a working bay by tech, vehicle, RO, job and clocked vs book', () => {
    const facts = bayFacts({ bay: bay({}), clockedSeconds: 3120, nowMs: now });
    expect(facts.map((fact) => fact.text)).toEqual([
      'Dana O.',
      'Norden Kestrel',
      'RO 4821',
      'Brake pads',
      '0.9 / 1.5 h',
    ]);
    expect(facts.find((fact) => fact.key === 'clocked')?.keep).toBe(true);
  });

  it('marks clocked time over book', () => {
    const fact = bayFacts({ bay: bay({}), clockedSeconds: 6000, nowMs: now }).find(
      (f) => f.key === 'clocked',
    );
    expect(fact).toMatchObject({ text: '1.7 h', tone: 'over', tag: '+0.2 h' });
  });

  it('keeps the clocked total and its excess on one line of a narrow tile', () => {
    const clocked = (clockedSeconds: number, bookHours: number, lineChars: number) =>
      bayFacts({ bay: bay({ bookSeconds: bookHours * 3600 }), clockedSeconds, nowMs: now, lineChars }).find(
        (f) => f.key === 'clocked',
      );
    // An 8-bay wall's tiles count 11 characters a line (5.4 em). Measured there in chromium: "1.6 h" and
    // its "+0.4 h" tag take 4.65 em, "11.4 h" and "+10.2 h" 5.64 em (the demo wall showed "11.…").
    expect(clocked(1.6 * 3600, 1.2, 11)).toMatchObject({ text: '1.6 h', tag: '+0.4 h' });
    expect(clocked(11.4 * 3600, 1.2, 11)).toMatchObject({ text: '11 h', tag: '+10 h' });
    // A 12-bay wall's smaller text leaves 13 characters: there the tenths fit.
    expect(clocked(11.4 * 3600, 1.2, 13)).toMatchObject({ text: '11.4 h', tag: '+10.2 h' });
    // Too little over book for a whole hour: the total alone, the bar shows the excess.
    const small = clocked(10.2 * 3600, 10, 10);
    expect(small).toMatchObject({ text: '10.2 h', tone: 'over' });
    expect(small?.tag).toBeUndefined();
  });

  it('gives a held bay its reason and how long it has been held', () => {
    const facts = bayFacts({
      bay: bay({ state: 'held', holdReason: 'parts', heldSince: '2026-03-02T14:18:00Z', technicians: [] }),
      clockedSeconds: 0,
      nowMs: now,
    });
    expect(facts[0]).toMatchObject({ key: 'reason', text: 'Parts', keep: true });
    expect(bandNote(bay({ state: 'held', heldSince: '2026-03-02T14:18:00Z' }), now)).toBe('42m');
    expect(bandNote(bay({ state: 'held', heldSince: '2026-03-02T13:55:00Z' }), now)).toBe('1h');
    expect(bandNote(bay({ state: 'held', heldSince: '2026-03-02T02:00:00Z' }), now)).toBe('13h');
    expect(bandNote(bay({ state: 'held', heldSince: '2026-02-27T15:00:00Z' }), now)).toBe('3d');
    expect(bandNote(bay({ state: 'working' }), now)).toBeNull();
  });

  it('says when held parts are due, in shop time, and flips to late once that time has passed', () => {
    // 2026-03-02 is in CST (UTC−6): 20:30Z is 2:30 PM in America/Chicago.
    const held = bay({ state: 'held', holdReason: 'parts', partsDueAt: '2026-03-02T20:30:00Z' });
    const at = (nowMs: number) =>
      bayFacts({ bay: held, clockedSeconds: 0, nowMs, timeZone: 'America/Chicago' }).slice(0, 2);
    expect(at(now)).toEqual([
      { key: 'reason', text: 'Parts due', keep: true },
      { key: 'parts-due', text: '2:30 pm', keep: true },
    ]);
    expect(at(Date.parse('2026-03-02T20:29:59Z')).map((fact) => fact.text)).toEqual(['Parts due', '2:30 pm']);
    expect(at(Date.parse('2026-03-02T20:30:00Z'))[0]).toMatchObject({ text: 'Parts late', tone: 'caution' });
    expect(at(Date.parse('2026-03-02T20:30:00Z'))[1]?.key).toBe('vehicle');
    const words = (patch: Partial<BoardBay>) =>
      holdFacts(bay({ state: 'held', ...patch }), now, 'America/Chicago').map((fact) => fact.text);
    expect(words({ holdReason: 'parts' })).toEqual(['Parts']);
    expect(words({ holdReason: 'sublet' })).toEqual(['Sublet']);
  });

  it('counts a timer down and warns of a running engine during a warm-up', () => {
    const facts = bayFacts({
      bay: bay({
        state: 'timer',
        timer: {
          id: 9,
          kind: 'warm-up',
          startedAt: '2026-03-02T14:55:00Z',
          targetC: 45,
          lastReadingC: 38.4,
          endsAt: null,
          etaAt: '2026-03-02T15:04:05Z',
          reached: false,
          note: null,
          status: 'estimating',
          confidence: 'medium',
        },
      }),
      clockedSeconds: 0,
      nowMs: now,
    });
    expect(facts[0]).toMatchObject({ key: 'countdown', text: '4:05', suffix: 'left', tone: 'big' });
    expect(facts.map((fact) => fact.text)).toContain('38° → 45°C');
    expect(facts.find((fact) => fact.key === 'engine')?.tone).toBe('caution');
  });

  it('says why a temperature timer has no time left to show', () => {
    const timer = {
      id: 9,
      kind: 'warm-up' as const,
      startedAt: '2026-03-02T14:55:00Z',
      targetC: 45,
      lastReadingC: 30,
      endsAt: null,
      etaAt: null,
      reached: false,
      note: null,
      confidence: 'low' as const,
    };
    expect(countdownFact({ ...timer, status: 'not-enough-readings' }, now).text).toBe('Estimating');
    expect(countdownFact({ ...timer, status: 'moving-away' }, now)).toMatchObject({
      text: 'Not warming',
      tone: 'caution',
    });
    expect(countdownFact({ ...timer, status: 'reached', reached: true }, now).text).toBe('Reached');
    expect(countdownFact({ ...timer, status: 'beyond-asymptote' }, now)).toMatchObject({
      text: 'Won’t reach target',
      tone: 'caution',
    });
    expect(countdownFact({ ...timer, status: 'estimating', etaAt: '2026-03-02T15:02:00Z' }, now).text).toBe(
      'about 2:00',
    );
    expect(
      countdownFact({ ...timer, kind: 'set-time', status: 'running', endsAt: '2026-03-02T17:05:00Z' }, now)
        .text,
    ).toBe('2:05:00');
  });

  it('keeps a rough countdown whole on a narrow tile: the words go, the figures stay', () => {
    const warmUp = (etaAt: string) =>
      bay({
        state: 'timer',
        timer: {
          id: 4,
          kind: 'warm-up',
          startedAt: '2026-03-02T14:55:00Z',
          targetC: 45,
          lastReadingC: 33,
          endsAt: null,
          etaAt,
          reached: false,
          note: null,
          status: 'estimating',
          confidence: 'low',
        },
      });
    const told = (lineChars: number, etaAt = '2026-03-02T15:03:43Z') => {
      const facts = bayFacts({ bay: warmUp(etaAt), clockedSeconds: 0, nowMs: now, lineChars });
      const countdown = facts[0]!;
      // The tile shortens a big countdown only when it is wider than the line (pickLines counts it as one).
      return [countdown.text, countdown.suffix, facts.find((fact) => fact.key === 'timer-kind')?.text];
    };
    expect(told(40)).toEqual(['about 3:43', 'left', 'Warm-up']);
    // Eight bays at 1920x1080 give a tile line 11 body characters: "about 3:43 left" was cut to "about 3…".
    expect(told(11)).toEqual(['3:43', 'left', 'Warm-up estimate']);
    expect(told(9)).toEqual(['3:43', undefined, 'Warm-up estimate']);
    expect(told(9, '2026-03-02T16:04:05Z')).toEqual(['1:04:05', undefined, 'Warm-up estimate']);
  });

  it('tells a free bay nothing more', () => {
    expect(bayFacts({ bay: bay({ state: 'free' }), clockedSeconds: 0, nowMs: now })).toEqual([]);
  });
});

describe(pickLines.name, () => {
  const fact = (text: string, keep = false): BayFact => ({ key: 'job', text, keep });
  const facts = [fact('a'), fact('b'), fact('c'), fact('k', true)];

  it('shows every fact when there is room', () => {
    expect(pickLines(facts, 4, 0).map((line) => line.fact.text)).toEqual(['a', 'b', 'c', 'k']);
  });

  it('keeps the kept fact and lets one line take the others in turn', () => {
    const texts = (turn: number) => pickLines(facts, 2, turn).map((line) => line.fact.text);
    expect(texts(0)).toEqual(['a', 'k']);
    expect(texts(1)).toEqual(['b', 'k']);
    expect(texts(2)).toEqual(['c', 'k']);
    expect(texts(3)).toEqual(['a', 'k']);
    expect(pickLines(facts, 2, 1)[0]?.rotating).toBe(true);
  });

  it('shows kept facts that fill every line, with none taking turns', () => {
    const two = [fact('a'), fact('k1', true), fact('k2', true), fact('b')];
    expect(pickLines(two, 2, 1).map((line) => [line.fact.text, line.rotating])).toEqual([
      ['k1', false],
      ['k2', false],
    ]);
    expect(pickLines(two, 3, 1).map((line) => line.fact.text)).toEqual(['b', 'k1', 'k2']);
  });

  it('gives a single line to the kept fact', () => {
    expect(pickLines(facts, 1, 5).map((line) => line.fact.text)).toEqual(['k']);
    expect(pickLines(facts, 0, 0)).toEqual([]);
  });

  it('wraps a fact longer than a line onto two, and leaves out one that takes turns on fewer lines', () => {
    const long = [fact('Replace rear wheel bearing'), fact('RO 4645'), fact('1:05 / 1:30', true)];
    const shown = (slots: number, turn = 0) =>
      pickLines(long, slots, turn, 16).map((line) => [line.fact.text, line.wraps]);
    expect(shown(4)).toEqual([
      ['Replace rear wheel bearing', true],
      ['RO 4645', false],
      ['1:05 / 1:30', false],
    ]);
    expect(shown(2, 0)).toEqual([
      ['RO 4645', false],
      ['1:05 / 1:30', false],
    ]);
    expect(shown(3, 0)).toEqual([
      ['Replace rear wheel bearing', true],
      ['1:05 / 1:30', false],
    ]);
    expect(shown(3, 1)).toEqual([
      ['RO 4645', false],
      ['1:05 / 1:30', false],
    ]);
  });

  it('shortens a fact longer than two lines to two, and a kept one to the single line left for it', () => {
    const longest = fact('x'.repeat(40));
    expect(pickLines([longest], 4, 0, 16)).toEqual([
      { fact: longest, rotating: false, wraps: true, shortened: true },
    ]);
    const kept = fact('Replace rear wheel bearing', true);
    expect(pickLines([kept, fact('RO 4645')], 1, 0, 16)).toEqual([
      { fact: kept, rotating: false, wraps: false, shortened: true },
    ]);
  });

  it('keeps a long model on a staged tile, shortened rather than left out, and its job title when there is room', () => {
    const model = 'Grand Voyager Extended Cab Heavy Duty 3500';
    const title = 'Replace front lower control arm bushings and align front end';
    const vehicle = `Wolverhampton-Kesselring ${model}`;
    const staged = bay({
      state: 'staged',
      vehicle: `2019 ${vehicle}`,
      jobLine: { id: 2, lineNo: 1, title, status: 'queued' },
      technicians: [{ id: 3, name: 'Jo W.' }],
    });
    // An 8-bay wall's tiles count 11 characters a line, and a staged tile there has two lines.
    const shown = (slots: number, turn = 0) =>
      pickLines(bayFacts({ bay: staged, clockedSeconds: 0, nowMs: now, lineChars: 11 }), slots, turn, 11).map(
        (line) => [line.fact.text, line.wraps, line.shortened],
      );
    // Two lines: the vehicle on one, its model cut short, and the RO and the technician taking turns on
    // the other (the job title is too long for one line and is left out).
    expect(shown(2, 0)).toEqual([
      [vehicle, false, true],
      ['RO 4821', false, false],
    ]);
    expect(shown(2, 1)).toEqual([
      [vehicle, false, true],
      ['Jo W.', false, false],
    ]);
    expect(shown(2, 2)).toEqual(shown(2, 0));
    expect(shown(1)).toEqual([[vehicle, false, true]]);
    expect(shown(3, 1)).toEqual([
      [vehicle, true, true],
      ['Jo W.', false, false],
    ]);
    expect(shown(6)).toEqual([
      [vehicle, true, true],
      ['RO 4821', false, false],
      [title, true, true],
      ['Jo W.', false, false],
    ]);
  });
});

describe('a long model on a tile of few lines', () => {
  const model = 'Grand Voyager Extended Cab Heavy Duty 3500';
  const long = (state: BoardBay['state']) =>
    bay({
      state,
      vehicle: `2019 Wolverhampton-Kesselring ${model}`,
      technicians: [{ id: 3, name: 'Jo W.' }],
    });
  const turns = (state: BoardBay['state'], slots: number) =>
    [0, 1, 2, 3, 4, 5].map((turn) =>
      pickLines(
        bayFacts({ bay: long(state), clockedSeconds: 600, nowMs: now, lineChars: 11 }),
        slots,
        turn,
        11,
      ).map((line) => [line.fact.key, line.wraps]),
    );

  it('cuts the model to one line on a ready tile, so the RO still has a line', () => {
    for (const lines of turns('ready', 2)) {
      expect(lines[0]).toEqual(['vehicle', false]);
      expect(lines).toHaveLength(2);
    }
    expect(turns('ready', 2).map((lines) => lines[1]?.[0])).toContain('ro');
  });

  it('gives a working tile’s model its turn on one line, beside the technician, the RO and the job', () => {
    const shown = turns('working', 2).map((lines) => lines[0]);
    expect(new Set(shown.map((line) => line?.[0]))).toEqual(new Set(['techs', 'vehicle', 'ro', 'job']));
    expect(shown.every((line) => line?.[1] === false)).toBe(true);
    expect(turns('working', 2).every((lines) => lines[1]?.[0] === 'clocked')).toBe(true);
  });

  it('shows the model on one line beside every other fact when that way they all fit', () => {
    const check = bay({
      state: 'check',
      vehicle: `2019 Wolverhampton-Kesselring ${model}`,
      technicians: [],
      jobLine: null,
    });
    for (const turn of [0, 1, 2])
      expect(
        pickLines(bayFacts({ bay: check, clockedSeconds: 0, nowMs: now, lineChars: 11 }), 2, turn, 11).map(
          (line) => [line.fact.key, line.wraps, line.rotating],
        ),
      ).toEqual([
        ['vehicle', false, false],
        ['ro', false, false],
      ]);
    expect(turns('ready', 3)[0]).toEqual([
      ['vehicle', false],
      ['ro', false],
      ['job', false],
    ]);
  });

  it('still wraps the model onto two lines where the tile has them to spare', () => {
    expect(turns('ready', 4)[0]).toEqual([
      ['vehicle', true],
      ['ro', false],
      ['job', false],
    ]);
  });
});

describe('short texts', () => {
  it('names every technician on one line, else whole names on two lines, else the first and a count', () => {
    const [dana, jo, sam] = [
      { id: 1, name: 'Dana O.' },
      { id: 2, name: 'Jo K.' },
      { id: 3, name: 'Sam O.' },
    ];
    expect(techsWords([])).toBeNull();
    expect(techsWords([dana], 4)).toEqual({ text: 'Dana O.' });
    expect(techsWords([dana, jo])).toEqual({ text: 'Dana O. + Jo K.' });
    expect(techsWords([dana, jo], 15)).toEqual({ text: 'Dana O. + Jo K.' });
    // The line breaks only between the names: "Dana O." over "+ Jo K.", a count when on one line.
    expect(techsWords([dana, jo], 11)).toEqual({
      text: 'Dana\u00a0O. +\u00a0Jo\u00a0K.',
      brief: 'Dana O. +1',
    });
    expect(techsWords([dana, jo, sam], 16)).toEqual({
      text: 'Dana\u00a0O.\u00a0+\u00a0Jo\u00a0K. +\u00a0Sam\u00a0O.',
      brief: 'Dana O. +2',
    });
    expect(techsWords([dana, jo, sam], 11)).toEqual({ text: 'Dana O. +2' });
    expect(techsWords([dana, jo], 6)).toEqual({ text: 'Dana O. +1' });
  });

  it('shows both technicians of a bay where the tile has the room, and the first and a count where not', () => {
    const two = bay({
      technicians: [
        { id: 1, name: 'Dana O.' },
        { id: 2, name: 'Jo K.' },
      ],
    });
    const lines = (lineChars: number, slots: number, turn = 0) =>
      pickLines(bayFacts({ bay: two, clockedSeconds: 600, nowMs: now, lineChars }), slots, turn, lineChars)
        .filter((line) => line.fact.key === 'techs')
        .map((line) => [line.fact.text.replaceAll('\u00a0', ' '), line.wraps, line.shortened]);
    // A four-bay wall's tiles hold 23 characters a line: both on one.
    expect(lines(23, 5)).toEqual([['Dana O. + Jo K.', false, false]]);
    expect(lines(23, 2)).toEqual([['Dana O. + Jo K.', false, false]]);
    // An 8-bay wall's 11: both on two lines while every fact still shows, the count on a line in turns.
    expect(lines(11, 6)).toEqual([['Dana O. + Jo K.', true, false]]);
    expect(lines(11, 5)).toEqual([['Dana O. +1', false, false]]);
    expect(lines(11, 2)).toEqual([['Dana O. +1', false, false]]);
    // A check tile keeps its technicians: the count, so the rest have a line to take turns on.
    const check = { ...two, state: 'check' as const };
    const shown = pickLines(bayFacts({ bay: check, clockedSeconds: 0, nowMs: now, lineChars: 11 }), 2, 0, 11);
    expect(shown[0]?.fact).toMatchObject({ key: 'techs', text: 'Dana O. +1' });
    expect(shown).toHaveLength(2);
  });

  it('drops a leading model year and keeps a two-word make whole, leaving the model for the ellipsis to cut', () => {
    const vehicle = 'Norrland Motor Vastra Long Wheelbase Touring';
    expect(wallVehicle(`2019 ${vehicle}`)).toBe(vehicle);
    expect(wallVehicle('  2019  Norrland Motor\tVastra ')).toBe('Norrland Motor Vastra');
    expect(wallVehicle('Norden 2019')).toBe('Norden 2019');
    expect(wallVehicle('2019')).toBe('2019');
    expect(wallVehicle('Kestrelmobile')).toBe('Kestrelmobile');
    expect(wallVehicle(' ')).toBeNull();
    expect(wallVehicle(null)).toBeNull();
    // On an 8-bay wall's line of 11 characters, with the RO and the technician taking turns below it.
    const lines = pickLines(
      bayFacts({
        bay: bay({ state: 'staged', vehicle: `2019 ${vehicle}` }),
        clockedSeconds: 0,
        nowMs: now,
        lineChars: 11,
      }),
      2,
      0,
      11,
    );
    expect(lines[0]).toMatchObject({
      fact: { key: 'vehicle', text: vehicle },
      wraps: false,
      shortened: true,
    });
  });
});
