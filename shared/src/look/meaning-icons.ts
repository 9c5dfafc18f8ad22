import type { FindingSeverity } from '../findings/findings.schema.js';

/**
 * Glyphs for meanings that are not bay states, drawn once here as strokes on a 24-unit grid (round
 * caps and joins, `currentColor`) and rendered by both apps. The seven state icons stay the states'
 * alone: a priority, a finding's severity, the final check still to do or an idle technician each
 * has its own drawing.
 */
export const MEANING_ICON_PATHS = {
  /** A job line's raised priority (high, urgent). */
  priority: ['M6 12.5l6-6 6 6', 'M6 18.5l6-6 6 6'],
  /** The final check is the next thing to do on a repair order. */
  'final-check-next': ['M9 3.5h6v3H9z', 'M9 5H6v15.5h12V5h-3', 'M9 13.5l2.2 2.2 3.8-4.2'],
  /** A finding that is a safety matter: fix now. */
  safety: ['M12 3l7.5 3v5.5c0 4.5-3.2 8-7.5 9.5-4.3-1.5-7.5-5-7.5-9.5V6z', 'M12 8.5V13', 'M12 16.2v.1'],
  /** A finding to fix soon. */
  soon: ['M3.5 12a8.5 8.5 0 1 0 17 0 8.5 8.5 0 1 0-17 0', 'M12 7.5V12l3 2'],
  /** A finding to keep an eye on. */
  watch: [
    'M2.5 12s3.5-6.5 9.5-6.5 9.5 6.5 9.5 6.5-3.5 6.5-9.5 6.5S2.5 12 2.5 12z',
    'M9 12a3 3 0 1 0 6 0 3 3 0 1 0-6 0',
  ],
  /** A technician on shift with no job on the clock. */
  idle: [
    'M5.8 7a3.2 3.2 0 1 0 6.4 0 3.2 3.2 0 1 0-6.4 0',
    'M3 20a6 6 0 0 1 12 0',
    'M16.5 17h.01M19 17h.01M21.5 17h.01',
  ],
} as const satisfies Record<string, readonly string[]>;

export type MeaningIcon = keyof typeof MEANING_ICON_PATHS;
export const MEANING_ICONS = Object.keys(MEANING_ICON_PATHS) as MeaningIcon[];

/** The one icon set for a finding's severity, on the kiosk and in the office. */
export const FINDING_SEVERITY_ICONS: Readonly<Record<FindingSeverity, MeaningIcon>> = {
  'safety-now': 'safety',
  soon: 'soon',
  watch: 'watch',
};
