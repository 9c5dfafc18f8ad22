import { MEANING_ICON_PATHS, type BayStateIcon, type MeaningIcon } from '@baytime/shared';
import type { ReactNode } from 'react';

type OwnGlyph = BayStateIcon | 'link-lost' | 'caution' | 'cup' | 'queue' | 'live';
export type GlyphName = OwnGlyph | MeaningIcon;

/**
 * Simple line drawings, thick enough to read across a shop. The seven state icons draw bay states
 * only; other meanings (priority, severity, idle...) use the shared glyphs the kiosk draws too.
 */
const PATHS: Record<OwnGlyph, ReactNode> = {
  'bay-empty': <rect x="4" y="4" width="16" height="16" rx="2" strokeDasharray="3.2 2.4" />,
  car: (
    <>
      <path d="M2.5 16.5V12.6L5.2 7.5h9.2l3.6 4.1 3.5 1v3.9" />
      <path d="M9.2 16.5h5.6" />
      <circle cx="6.8" cy="16.6" r="2.1" />
      <circle cx="17" cy="16.6" r="2.1" />
    </>
  ),
  wrench: (
    <path d="M15 3.6a4.8 4.8 0 0 0-4.5 6.5L3.6 17l3.4 3.4 6.9-6.9a4.8 4.8 0 0 0 6.5-4.5l-2.9 2.9-3-.6-.6-3z" />
  ),
  hourglass: (
    <>
      <path d="M6 3h12M6 21h12" />
      <path d="M7.5 3c0 5.2 4.5 6 4.5 9s-4.5 3.8-4.5 9M16.5 3c0 5.2-4.5 6-4.5 9s4.5 3.8 4.5 9" />
    </>
  ),
  pause: (
    <>
      <path d="M8.5 5v14M15.5 5v14" strokeWidth="3.6" />
    </>
  ),
  magnifier: (
    <>
      <circle cx="10.5" cy="10.5" r="6.2" />
      <path d="M15.2 15.2l5.3 5.3" />
    </>
  ),
  flag: <path d="M5.5 21V3.5M5.5 4.5h12l-2.6 4.2 2.6 4.3h-12" />,
  'link-lost': (
    <>
      <path d="M9.5 7.5H7.2a4.5 4.5 0 0 0 0 9h2.3M14.5 7.5h2.3a4.5 4.5 0 0 1 0 9h-2.3" />
      <path d="M4 3l16 18" />
    </>
  ),
  caution: (
    <>
      <path d="M12 3.2L2.2 20.3h19.6z" />
      <path d="M12 9.5v5M12 17.2v.3" />
    </>
  ),
  cup: (
    <>
      <path d="M4 8h12v5.5a5 5 0 0 1-5 5H9a5 5 0 0 1-5-5z" />
      <path d="M16 10h1.8a2.6 2.6 0 0 1 0 5.2H16" />
    </>
  ),
  queue: <path d="M4 6h16M4 12h16M4 18h10" />,
  live: <circle cx="12" cy="12" r="6" fill="currentColor" stroke="none" />,
};

export interface GlyphProps {
  name: GlyphName;
  className?: string;
  /** Spoken name; omit when a word beside the glyph already says it. */
  title?: string;
}

export function Glyph({ name, className, title }: GlyphProps) {
  return (
    <svg
      className={className}
      viewBox="0 0 24 24"
      fill="none"
      stroke="currentColor"
      strokeWidth="2.4"
      strokeLinecap="round"
      strokeLinejoin="round"
      role={title ? 'img' : undefined}
      aria-hidden={title ? undefined : true}
      aria-label={title}
      focusable="false"
    >
      {name in MEANING_ICON_PATHS
        ? MEANING_ICON_PATHS[name as MeaningIcon].map((d) => <path key={d} d={d} />)
        : PATHS[name as OwnGlyph]}
    </svg>
  );
}
