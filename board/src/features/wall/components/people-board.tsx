import type { CSSProperties } from 'react';
import type { BoardPerson } from '@baytime/shared';
import { PERSON_ROW_UNITS, personChips, shiftCounts, type PeopleLayout } from '../people-pages';
import { pageItems } from '../wall-layout';
import { PersonChipView } from './people-strip';
import styles from './wall.module.css';

export interface PeopleBoardProps {
  people: readonly BoardPerson[];
  nowMs: number;
  layout: PeopleLayout;
  /** Which of the people's pages, from 0. */
  page: number;
  /** Measures the area it fills, as the grid of bays does. */
  areaRef: (element: HTMLElement | null) => void;
}

/**
 * Everyone on shift on a page of their own, among the bays' pages, once the strip would need more than
 * six turns to show them all: idle people first, down the columns.
 */
export function PeopleBoard({ people, nowMs, layout, page, areaRef }: PeopleBoardProps) {
  const chips = pageItems(personChips(people, nowMs), layout, page);
  return (
    <section
      ref={areaRef}
      className={styles.peopleBoard}
      aria-label="People on shift"
      style={
        {
          '--people-scale': layout.scale,
          gridTemplateColumns: `repeat(${layout.columns}, minmax(0, 1fr))`,
          gridTemplateRows: `repeat(${layout.rows + 1}, calc(var(--u) * ${PERSON_ROW_UNITS.height * layout.scale}))`,
        } as CSSProperties
      }
    >
      <h2 className={styles.peopleHeading}>{shiftCounts(people)}</h2>
      {chips.map((chip) => (
        <PersonChipView key={chip.id} chip={chip} className={styles.personRow} />
      ))}
    </section>
  );
}
