import {
  HOLD_REASON_LABELS,
  TIMER_KIND_LABELS,
  TIMER_STATE_WORDS,
  aboutWords,
  formatCountdown,
  hoursFigure,
  movingAwayWords,
  type BoardBay,
  type BoardPersonRef,
  type BoardTimer,
} from '@baytime/shared';
import { secondsSince, secondsUntil } from './server-clock';
import { formatTimeOfDay } from './board-time';
import { BODY_UNITS, TILE_METRICS } from './wall-layout';

/** One short line a tile can show under the bay's name and state. */
export interface BayFact {
  key:
    | 'techs'
    | 'clocked'
    | 'countdown'
    | 'timer-kind'
    | 'timer-note'
    | 'temps'
    | 'engine'
    | 'reason'
    | 'parts-due'
    | 'vehicle'
    | 'ro'
    | 'job';
  text: string;
  /** Kept on screen when lines are short; the others share one line in turn. */
  keep: boolean;
  tone?: 'over' | 'big' | 'caution';
  /** A quiet word after the text ("left"). */
  suffix?: string;
  /** A figure in a tag after the text: how far over book ("+0.4 h"). */
  tag?: string;
  /**
   * Gives up its second line before the others lose theirs: a long model is cut to one line, with an
   * ellipsis, rather than hide the RO and the technician on a short tile.
   */
  yields?: boolean;
  /** What a fact that yields says when cut to one line, instead of its text ending in an ellipsis. */
  brief?: string;
}

export interface ClockedBar {
  /** Share of the bar filled by clocked time up to the book time, 0–1. */
  withinBook: number;
  /** Share of the bar past the book time, 0–1 (zero while under book). */
  overBook: number;
  /** Where the book time sits on the bar, 0–1. */
  bookMark: number;
  overSeconds: number;
}

/** The bar scales to the larger of book and clocked time, so time over book shows as its own segment. */
export function clockedBar(clockedSeconds: number, bookSeconds: number): ClockedBar | null {
  if (bookSeconds <= 0) return null;
  const scale = Math.max(bookSeconds, clockedSeconds);
  const within = Math.min(clockedSeconds, bookSeconds) / scale;
  const overSeconds = Math.max(0, clockedSeconds - bookSeconds);
  return { withinBook: within, overBook: overSeconds / scale, bookMark: bookSeconds / scale, overSeconds };
}

/** Joins a name to the next on a tile's line; never broken itself, so each line holds whole names. */
const NO_BREAK = '\u00a0';

/**
 * Who works the bay, in words a tile of `lineChars` a line can hold: every name on one line ("Dana O. +
 * Jo K."), else whole names on two lines ("Dana O." over "+ Jo K."), else the first and a count ("Dana
 * O. +1"). The count is also the `brief` the tile shows when it has a single line to give them.
 */
export function techsWords(
  technicians: readonly BoardPersonRef[],
  lineChars = Infinity,
): { text: string; brief?: string } | null {
  const [first, ...rest] = technicians.map((technician) => technician.name);
  if (first === undefined) return null;
  const all = [first, ...rest].join(' + ');
  if (!rest.length || all.length <= lineChars) return { text: all };
  const brief = `${first} +${rest.length}`;
  const lines = [first];
  for (const name of rest) {
    const last = lines[lines.length - 1]!;
    if (`${last} + ${name}`.length <= lineChars) lines[lines.length - 1] = `${last} + ${name}`;
    else lines.push(`+ ${name}`);
  }
  const text = lines.map((line) => line.replaceAll(' ', NO_BREAK)).join(' ');
  // factHeight counts a fact's lines by its length: two lines of whole names must also count as two.
  const fits =
    lines.length <= 2 && lines.every((line) => line.length <= lineChars) && text.length <= 2 * lineChars;
  return fits ? { text, brief } : { text: brief };
}

/**
 * The vehicle as its repair order names it, without a leading model year: make and model tell two cars
 * apart across the floor. A line too short for it ends in an ellipsis, so it is the model that gets cut.
 * The board gets make and model as one string and cannot tell a two-word make from a make and the first
 * word of a model, so it drops no other word.
 */
export function wallVehicle(vehicle: string | null): string | null {
  const words = vehicle?.trim().split(/\s+/) ?? [];
  const year = words.length > 1 && /^(19|20)\d{2}$/.test(words[0]!);
  return words.slice(year ? 1 : 0).join(' ') || null;
}

/**
 * A big countdown's width in body characters of `lineChars` (0.47 em at body size): the big line is
 * 10 units of bold to the body's 7.4, with figures of about 0.52 em, the colon 0.26 and letters 0.55
 * (Barlow Semi Condensed Bold, rounded up from chromium's widths).
 */
function bigChars(text: string): number {
  const ems = [...text].reduce((sum, char) => sum + (/\d/.test(char) ? 0.52 : char === ':' ? 0.26 : 0.55), 0);
  return (ems * TILE_METRICS.bigLine) / (BODY_UNITS * 0.47);
}

/** " left" after a big countdown, in body characters. */
const LEFT_CHARS = ' left'.length;

/**
 * The timer's headline: time left when known, otherwise a word for why it is not. The time left is
 * what the tile is there for, so on a line too short for "about 3:43 left" the words go, never the
 * figures: "about" first (the kind line says it is an estimate then), then "left".
 */
export function countdownFact(timer: BoardTimer, nowMs: number, lineChars = Infinity): BayFact {
  if (timer.reached || timer.status === 'reached')
    return { key: 'countdown', text: TIMER_STATE_WORDS.reached, keep: true };
  if (timer.status === 'done') return { key: 'countdown', text: TIMER_STATE_WORDS.done, keep: true };
  if (timer.status === 'moving-away')
    return {
      key: 'countdown',
      text: movingAwayWords(timer.kind),
      keep: true,
      tone: 'caution',
    };
  const left = secondsUntil(timer.endsAt ?? timer.etaAt, nowMs);
  if (left === null)
    return {
      key: 'countdown',
      text: TIMER_STATE_WORDS[timer.status === 'running' ? 'estimating' : timer.status],
      keep: true,
      ...(timer.status === 'beyond-asymptote' && { tone: 'caution' as const }),
    };
  if (left === 0) return { key: 'countdown', text: 'Due now', keep: true, tone: 'big' };
  const countdown = formatCountdown(left);
  const big = { key: 'countdown', keep: true, tone: 'big' } as const;
  // A temperature estimate on thin evidence is shown as approximate.
  if (isRough(timer) && bigChars(aboutWords(countdown)) + LEFT_CHARS <= lineChars)
    return { ...big, text: aboutWords(countdown), suffix: 'left' };
  if (bigChars(countdown) + LEFT_CHARS <= lineChars) return { ...big, text: countdown, suffix: 'left' };
  return { ...big, text: countdown };
}

function isRough(timer: BoardTimer): boolean {
  return timer.kind !== 'set-time' && timer.confidence === 'low';
}

/**
 * Why a held bay waits: for parts with a known arrival, "Parts due" and "2:30 PM" in the shop's time
 * (two lines: one is too long for a tile), and "Parts late" once that time has passed by the server's
 * clock: the tile flips by itself.
 */
export function holdFacts(bay: BoardBay, nowMs: number, timeZone: string | undefined): BayFact[] {
  const due = bay.holdReason === 'parts' && bay.partsDueAt ? Date.parse(bay.partsDueAt) : NaN;
  if (Number.isFinite(due))
    return nowMs >= due
      ? [{ key: 'reason', text: 'Parts late', keep: true, tone: 'caution' }]
      : [
          { key: 'reason', text: 'Parts due', keep: true },
          { key: 'parts-due', text: formatTimeOfDay(due, timeZone), keep: true },
        ];
  return [
    {
      key: 'reason',
      text: bay.holdReason ? HOLD_REASON_LABELS[bay.holdReason] : 'No reason given',
      keep: true,
    },
  ];
}

/**
 * Figures and "h" take 0.40–0.43 em in the wall's font, where a line's `lineChars` counts 0.47 em a
 * character; the tag's padding and the gap before it take about 0.35 em (measured in chromium).
 */
const FIGURE_CHARS = 0.92;
const TAG_CHARS = 0.75;

/**
 * The clocked total and the excess over book, as they fit one line of `lineChars`: with tenths ("10.6 h"
 * "+9.1 h"), else in whole hours ("11 h" "+10 h"), else the total alone: the bar and the line's colour
 * still say it is over.
 */
function overBook(
  clockedSeconds: number,
  bookSeconds: number,
  lineChars = Infinity,
): { text: string; tag?: string } {
  const [clocked, excess] = [clockedSeconds / 3600, (clockedSeconds - bookSeconds) / 3600];
  const fits = ({ text, tag }: { text: string; tag: string }) =>
    (text.length + tag.length) * FIGURE_CHARS + TAG_CHARS <= lineChars;
  const tenths = { text: `${hoursFigure(clocked, 1)} h`, tag: `+${hoursFigure(excess, 1)} h` };
  if (fits(tenths)) return tenths;
  const whole = { text: `${Math.round(clocked)} h`, tag: `+${Math.round(excess)} h` };
  return Math.round(excess) >= 1 && fits(whole) ? whole : { text: tenths.text };
}

export interface FactInput {
  bay: BoardBay;
  clockedSeconds: number;
  nowMs: number;
  /** The shop's time zone, for times of day. */
  timeZone?: string;
  /** Characters a body line holds on this tile. */
  lineChars?: number;
}

/** The facts a tile tells about its bay, in reading order; which ones show depends on the room. */
export function bayFacts({ bay, clockedSeconds, nowMs, timeZone, lineChars }: FactInput): BayFact[] {
  const facts: BayFact[] = [];
  const add = (fact: BayFact | null) => {
    if (fact && fact.text) facts.push(fact);
  };
  const techsSaid = techsWords(bay.technicians, lineChars);
  const techs = (keep: boolean): BayFact | null =>
    techsSaid && {
      key: 'techs',
      keep,
      text: techsSaid.text,
      ...(techsSaid.brief !== undefined && { brief: techsSaid.brief, yields: true }),
    };
  const vehicle = wallVehicle(bay.vehicle);
  const vehicleFact = vehicle
    ? ({ key: 'vehicle', text: vehicle, keep: false, yields: true } as const)
    : null;
  const roFact = bay.repairOrder
    ? ({ key: 'ro', text: `RO ${bay.repairOrder.number}`, keep: false } as const)
    : null;
  const jobFact = bay.jobLine ? ({ key: 'job', text: bay.jobLine.title, keep: false } as const) : null;
  const over = bay.bookSeconds > 0 && clockedSeconds > bay.bookSeconds;
  // Over book the line gives the clocked total and a tag with the excess; the bar marks where book ends.
  const clocked: BayFact | null =
    bay.bookSeconds > 0 || clockedSeconds > 0
      ? over
        ? {
            key: 'clocked',
            keep: true,
            tone: 'over',
            ...overBook(clockedSeconds, bay.bookSeconds, lineChars),
          }
        : {
            key: 'clocked',
            text: `${hoursFigure(clockedSeconds / 3600, 1)} / ${hoursFigure(bay.bookSeconds / 3600, 1)} h`,
            keep: true,
          }
      : null;

  switch (bay.state) {
    case 'free':
      break;
    case 'staged':
      add(vehicleFact && { ...vehicleFact, keep: true });
      add(roFact);
      add(jobFact);
      add(techs(false));
      break;
    case 'working':
      add(techs(false));
      add(vehicleFact);
      add(roFact);
      add(jobFact);
      add(clocked);
      break;
    case 'timer': {
      const timer = bay.timer;
      if (timer) {
        const countdown = countdownFact(timer, nowMs, lineChars);
        add(countdown);
        const roughAndUnsaid =
          isRough(timer) && countdown.tone === 'big' && !countdown.text.startsWith(aboutWords(''));
        const kind = TIMER_KIND_LABELS[timer.kind];
        add({ key: 'timer-kind', text: roughAndUnsaid ? `${kind} estimate` : kind, keep: false });
        add(timer.note ? { key: 'timer-note', text: timer.note, keep: false } : null);
        if (timer.targetC !== null) {
          const target = `${Math.round(timer.targetC)}°C`;
          const text =
            timer.lastReadingC === null ? `to ${target}` : `${Math.round(timer.lastReadingC)}° → ${target}`;
          add({ key: 'temps', text, keep: false });
        }
        // A warm-up means an engine running in the bay: say so to everyone walking past.
        if (timer.kind === 'warm-up' && !timer.reached)
          add({ key: 'engine', text: 'Engine on', keep: false, tone: 'caution' });
      }
      add(techs(false));
      add(vehicleFact);
      add(roFact);
      break;
    }
    case 'held':
      // How long it has been held rides in the state band (see bandNote), so the reason keeps a line.
      for (const fact of holdFacts(bay, nowMs, timeZone)) add(fact);
      add(vehicleFact);
      add(roFact);
      add(jobFact);
      break;
    case 'check':
      add(techs(true));
      add(vehicleFact);
      add(roFact);
      add(jobFact);
      break;
    case 'ready':
      add(vehicleFact && { ...vehicleFact, keep: true });
      add(roFact);
      add(jobFact);
      break;
  }
  return facts;
}

/** A short figure shown at the end of the state band: how long a held bay has been held. */
export function bandNote(bay: BoardBay, nowMs: number): string | null {
  if (bay.state !== 'held' || !bay.heldSince) return null;
  // Three characters after the word ("42m", "1h", "11h", "2d"): with the icon on four columns of
  // tiles, without it on five (heldBandParts). The office's floor view gives the minutes.
  const minutes = Math.floor(secondsSince(bay.heldSince, nowMs) / 60);
  if (minutes < 60) return `${Math.max(1, minutes)}m`;
  const hours = Math.floor(minutes / 60);
  return hours < 24 ? `${hours}h` : `${Math.floor(hours / 24)}d`;
}

export interface TileLine {
  fact: BayFact;
  /** This line takes turns with other facts. */
  rotating: boolean;
  /** The fact takes two lines. */
  wraps: boolean;
  /** The fact is longer than its lines: the tile ends it with an ellipsis, keeping its first words. */
  shortened: boolean;
}

/** Lines a fact's whole text takes on a tile whose lines hold `lineChars` characters: a big countdown is one. */
function textLines(fact: BayFact, lineChars: number): number {
  if (fact.tone === 'big') return 1;
  const length = fact.text.length + (fact.suffix ? fact.suffix.length + 1 : 0);
  return Math.max(1, Math.ceil(length / lineChars));
}

/** Lines a fact takes on a tile: at most two, however long its text. */
export function factHeight(fact: BayFact, lineChars: number): number {
  return Math.min(2, textLines(fact, lineChars));
}

/**
 * Fits facts into `slots` lines. A fact longer than a line wraps onto a second, and one longer than two
 * lines is shortened to two. When they all fit they all show. Otherwise the kept facts stay, one of them
 * shortened to a single line when only one is left for it, and unless they fill every line the others
 * take turns on the lines left (`turn` counts up every few seconds), in reading order: one taller than
 * those lines is left out, unless it yields (the vehicle, two technicians' names), which takes its turn
 * cut to those lines, saying its `brief` on one. A
 * fact that yields gives up its second line first: so that every fact shows, or, when kept, so that the
 * others have a line to take turns on.
 */
export function pickLines(facts: BayFact[], slots: number, turn: number, lineChars = Infinity): TileLine[] {
  if (slots <= 0) return [];
  const height = (fact: BayFact) => factHeight(fact, lineChars);
  const line = (whole: BayFact, rotating: boolean, lines = height(whole)): TileLine => {
    const fact = whole.brief !== undefined && lines < height(whole) ? { ...whole, text: whole.brief } : whole;
    return { fact, rotating, wraps: lines > 1, shortened: textLines(fact, lineChars) > lines };
  };
  const total = (list: BayFact[]) => list.reduce((sum, fact) => sum + height(fact), 0);
  if (total(facts) <= slots) return facts.map((fact) => line(fact, false));
  // All of them fit when those that yield take one line each: they do, and the lines to spare go to
  // their second lines in reading order.
  const oneLine = facts.reduce((sum, fact) => sum + (fact.yields ? 1 : height(fact)), 0);
  if (oneLine <= slots) {
    let spare = slots - oneLine;
    return facts.map((fact) => {
      if (!fact.yields || height(fact) === 1) return line(fact, false);
      const lines = spare > 0 ? 2 : 1;
      spare -= lines - 1;
      return line(fact, false, lines);
    });
  }
  const keptAll = facts.filter((fact) => fact.keep);
  const keptHeight = new Map(keptAll.map((fact) => [fact, height(fact)]));
  const keptTotal = () => [...keptHeight.values()].reduce((sum, lines) => sum + lines, 0);
  for (const fact of keptAll) if (fact.yields && keptTotal() >= slots) keptHeight.set(fact, 1);
  // The kept facts leave a line for the others to take turns on, unless they fill every line.
  const budget = keptTotal() >= slots ? slots : slots - 1;
  const kept = new Map<BayFact, number>();
  let used = 0;
  for (const [fact, wanted] of keptHeight) {
    const lines = Math.min(wanted, budget - used);
    if (lines <= 0) break;
    kept.set(fact, lines);
    used += lines;
  }
  const room = slots - used;
  const others = facts.filter((fact) => !kept.has(fact) && room > 0 && (height(fact) <= room || fact.yields));
  const shown = others.length ? others[((turn % others.length) + others.length) % others.length] : undefined;
  const firstOther = facts.findIndex((fact) => !kept.has(fact));
  const lines: TileLine[] = [];
  facts.forEach((fact, index) => {
    const keptLines = kept.get(fact);
    if (keptLines !== undefined) lines.push(line(fact, false, keptLines));
    else if (index === firstOther && shown) lines.push(line(shown, true, Math.min(height(shown), room)));
  });
  return lines;
}
