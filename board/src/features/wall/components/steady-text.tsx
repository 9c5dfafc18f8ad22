import styles from './wall.module.css';

export interface SteadyTextProps {
  text: string;
  /** The widest `text` gets: its room is kept while the text is narrower. */
  widest: string;
  className?: string;
}

/**
 * A figure that changes as the board ticks, in a box as wide as it can get, so what sits beside it
 * holds still. The widest text is drawn hidden by CSS: no screen reader or text search finds it.
 */
export function SteadyText({ text, widest, className }: SteadyTextProps) {
  return (
    <span className={`${styles.steady} ${className ?? ''}`} data-widest={widest}>
      <span>{text}</span>
    </span>
  );
}
