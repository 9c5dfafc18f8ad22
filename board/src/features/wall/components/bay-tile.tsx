import { BAY_PALETTE, formatHours, type BoardBay } from '@baytime/shared';
import { Glyph } from '@/components/glyph';
import { clockedSecondsAt } from '../board-store';
import { bandNote, bayFacts, clockedBar, pickLines, type TileLine } from '../bay-facts';
import { heldBandParts, lineChars, tileRoom } from '../wall-layout';
import styles from './wall.module.css';

export interface BayTileProps {
  bay: BoardBay;
  /** Server time (ms) the bay's clocked total was counted to. */
  asOfMs: number | undefined;
  /** Server time now (ms). */
  nowMs: number;
  /** The shop's time zone. */
  timeZone: string;
  /** Tile size in board units: decides how many lines fit and how long they may be. */
  height: number;
  width: number;
  /** Share of the full text sizes the tile's text uses (see wallLayout). */
  scale: number;
  /** Counts up every few seconds; facts that share a line take turns by it. */
  turn: number;
}

const BAR_STATES = new Set<BoardBay['state']>(['working', 'held', 'check']);

export function BayTile({ bay, asOfMs, nowMs, timeZone, height, width, scale, turn }: BayTileProps) {
  const look = BAY_PALETTE[bay.state];
  const clocked = clockedSecondsAt(bay, asOfMs, nowMs);
  const chars = lineChars(width, scale);
  const told = bayFacts({ bay, clockedSeconds: clocked, nowMs, timeZone, lineChars: chars });
  // A tile too short for a big countdown still shows it, at body size.
  const bigFits = tileRoom(height, false, scale).slotsWithBig > 0;
  const facts = bigFits
    ? told
    : told.map((fact) => (fact.tone === 'big' ? { ...fact, tone: undefined } : fact));
  const hasBig = facts.some((fact) => fact.tone === 'big');
  const slots = (withBar: boolean) => {
    const room = tileRoom(height, withBar, scale);
    return hasBig ? room.slotsWithBig : room.slots;
  };
  // The bar repeats the clocked line in a picture: a small tile keeps the line and drops the bar.
  const barFits = facts.length === 0 || slots(true) > 0;
  const booked = clockedBar(clocked, bay.bookSeconds);
  const bar = BAR_STATES.has(bay.state) && barFits ? booked : null;
  const lines = pickLines(facts, slots(bar !== null), turn, chars);
  const held = bandNote(bay, nowMs);
  const room = held ? heldBandParts(width, scale) : { icon: true, note: false };
  const note = room.note ? held : null;

  return (
    <article
      className={`${styles.tile} ${bay.state === 'free' ? styles.tileFree : ''}`}
      aria-label={bay.name}
    >
      <div className={styles.bayName}>{bay.name}</div>
      <div className={styles.band} style={{ background: look.colour, color: look.textColour }}>
        {room.icon && <Glyph name={look.icon} className={styles.glyph} />}
        <span className={styles.bandWord}>{look.label}</span>
        {note && <span className={styles.bandNote}>{note}</span>}
      </div>
      <div className={styles.lines}>
        {lines.map((line) => (
          <FactLine key={line.rotating ? `turn-${line.fact.key}` : line.fact.key} line={line} />
        ))}
      </div>
      {bar && (
        <div
          className={styles.bar}
          role="img"
          aria-label={`${formatHours(clocked)} clocked of ${formatHours(bay.bookSeconds)} book`}
        >
          <div className={styles.barWithin} style={{ width: `${bar.withinBook * 100}%` }} />
          {bar.overBook > 0 && (
            <div
              className={styles.barOver}
              style={{ left: `${bar.bookMark * 100}%`, width: `${bar.overBook * 100}%` }}
            />
          )}
          <div className={styles.barBook} style={{ left: `${bar.bookMark * 100}%` }} />
        </div>
      )}
    </article>
  );
}

function FactLine({ line }: { line: TileLine }) {
  const { fact } = line;
  const toneClass =
    fact.tone === 'big'
      ? styles.lineBig
      : fact.tone === 'over'
        ? styles.lineOver
        : fact.tone === 'caution'
          ? styles.lineCaution
          : '';
  return (
    <div className={`${styles.line} ${toneClass} ${line.rotating ? styles.lineTurn : ''}`}>
      {fact.tone === 'caution' && <Glyph name="caution" className={styles.glyph} />}
      <span
        className={`${styles.lineText} ${line.wraps ? styles.lineWraps : ''}`}
        data-shortened={line.shortened || undefined}
      >
        {fact.text}
        {fact.suffix && <span className={styles.lineSuffix}> {fact.suffix}</span>}
      </span>
      {fact.tag && <span className={styles.overTag}>{fact.tag}</span>}
    </div>
  );
}
