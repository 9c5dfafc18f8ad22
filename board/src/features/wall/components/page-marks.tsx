import { SteadyText } from './steady-text';
import styles from './wall.module.css';

/** Beyond this many pages a row of dots is too long to read at a glance, and crowds what it counts. */
const MOST_DOTS = 6;

export interface PageMarksProps {
  /** The page on screen, from 0. */
  page: number;
  pages: number;
  /** Read out as "Page 2 of 3"; false when what it pages is not read out itself. */
  announced: boolean;
  /** False where room is short and the count alone will do. */
  dots?: boolean;
  className?: string;
}

/** Where a turning display stands: a dot per page while there are few, and always "page/pages". */
export function PageMarks({ page, pages, announced, dots = true, className }: PageMarksProps) {
  if (pages < 2) return null;
  return (
    <div
      className={`${styles.pageDots} ${className ?? ''}`}
      {...(announced ? { 'aria-label': `Page ${page + 1} of ${pages}` } : { 'aria-hidden': true })}
    >
      {dots &&
        pages <= MOST_DOTS &&
        Array.from({ length: pages }, (_, index) => (
          <span key={index} className={`${styles.pageDot} ${index === page ? styles.pageDotOn : ''}`} />
        ))}
      <SteadyText text={`${page + 1}/${pages}`} widest={`${pages}/${pages}`} className={styles.pageCount} />
    </div>
  );
}
