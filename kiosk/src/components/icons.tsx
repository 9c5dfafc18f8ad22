import type { SVGProps } from 'react';
import { MEANING_ICON_PATHS, type MeaningIcon } from '@baytime/shared';

/** Baytime's own line icons: 24-unit grid, 2-unit strokes, drawn to read at arm's length. */
function Icon({ children, ...props }: SVGProps<SVGSVGElement>) {
  return (
    <svg
      viewBox="0 0 24 24"
      width="1em"
      height="1em"
      fill="none"
      stroke="currentColor"
      strokeWidth={2.2}
      strokeLinecap="round"
      strokeLinejoin="round"
      aria-hidden="true"
      focusable="false"
      {...props}
    >
      {children}
    </svg>
  );
}

type P = SVGProps<SVGSVGElement>;

export const PlayIcon = (p: P) => (
  <Icon {...p}>
    <path d="M8 5.5v13l10.5-6.5z" fill="currentColor" />
  </Icon>
);
export const StopIcon = (p: P) => (
  <Icon {...p}>
    <rect x="6.5" y="6.5" width="11" height="11" rx="1.5" fill="currentColor" />
  </Icon>
);
export const PauseIcon = (p: P) => (
  <Icon {...p}>
    <path d="M9 6v12M15 6v12" strokeWidth={3} />
  </Icon>
);
export const CheckIcon = (p: P) => (
  <Icon {...p}>
    <path d="M5 12.5l4.5 4.5L19 7.5" strokeWidth={2.8} />
  </Icon>
);
export const WrenchIcon = (p: P) => (
  <Icon {...p}>
    <path d="M14.5 4.5a4.5 4.5 0 0 0-4.2 6.1L4.5 16.4a1.9 1.9 0 0 0 2.7 2.7l5.8-5.8a4.5 4.5 0 0 0 6.1-4.2l-2.7 2.2-2.6-.5-.5-2.6z" />
  </Icon>
);
/** The "My day" tab: a sun, so the wrench stays the Working state's. */
export const DayIcon = (p: P) => (
  <Icon {...p}>
    <circle cx="12" cy="12" r="4" />
    <path d="M12 2.5v2.2M12 19.3v2.2M2.5 12h2.2M19.3 12h2.2M5.3 5.3l1.5 1.5M17.2 17.2l1.5 1.5M5.3 18.7l1.5-1.5M17.2 6.8l1.5-1.5" />
  </Icon>
);
export const QueueIcon = (p: P) => (
  <Icon {...p}>
    <path d="M5 7h14M5 12h14M5 17h8" />
  </Icon>
);
export const MealIcon = (p: P) => (
  <Icon {...p}>
    <path d="M7 3v8M4.5 3v5a2.5 2.5 0 0 0 5 0V3M7 11v10M16.5 21V3c-2 1-3.5 3.5-3.5 7h3.5" />
  </Icon>
);
export const CupIcon = (p: P) => (
  <Icon {...p}>
    <path d="M5 9h11v5a5 5 0 0 1-5 5h-1a5 5 0 0 1-5-5zM16 10.5h1.5a2.5 2.5 0 0 1 0 5H16M9 3.5c-.6.9.6 1.6 0 2.5M12.5 3.5c-.6.9.6 1.6 0 2.5" />
  </Icon>
);
export const DoorInIcon = (p: P) => (
  <Icon {...p}>
    <path d="M13 4h5a1 1 0 0 1 1 1v14a1 1 0 0 1-1 1h-5M3.5 12h10M10 8.5l3.5 3.5-3.5 3.5" />
  </Icon>
);
export const DoorOutIcon = (p: P) => (
  <Icon {...p}>
    <path d="M11 4H6a1 1 0 0 0-1 1v14a1 1 0 0 0 1 1h5M10 12h10.5M17 8.5l3.5 3.5-3.5 3.5" />
  </Icon>
);
export const BackspaceIcon = (p: P) => (
  <Icon {...p}>
    <path d="M8.5 5.5H20a1 1 0 0 1 1 1v11a1 1 0 0 1-1 1H8.5L3 12z" />
    <path d="M11.5 9.5l5 5M16.5 9.5l-5 5" />
  </Icon>
);
export const ArrowRightIcon = (p: P) => (
  <Icon {...p}>
    <path d="M4 12h15M13.5 6.5L19 12l-5.5 5.5" strokeWidth={2.6} />
  </Icon>
);
export const CloudOffIcon = (p: P) => (
  <Icon {...p}>
    <path d="M7 18.5h10a4 4 0 0 0 .9-7.9A6 6 0 0 0 7.2 9 4.8 4.8 0 0 0 7 18.5zM4 4l16 16" />
  </Icon>
);
export const UploadIcon = (p: P) => (
  <Icon {...p}>
    <path d="M12 16V5M7.5 9.5L12 5l4.5 4.5M5 19h14" />
  </Icon>
);
export const AlertIcon = (p: P) => (
  <Icon {...p}>
    <path d="M12 3.5l9.5 16.5h-19z" />
    <path d="M12 10v4.5M12 17.2v.1" strokeWidth={2.6} />
  </Icon>
);
export const BellIcon = (p: P) => (
  <Icon {...p}>
    <path d="M6 16.5V11a6 6 0 0 1 12 0v5.5l1.5 2h-15zM10 20.5a2 2 0 0 0 4 0" />
  </Icon>
);
export const TimerIcon = (p: P) => (
  <Icon {...p}>
    <circle cx="12" cy="13.5" r="7" />
    <path d="M12 13.5V9.5M9.5 3h5M18.5 6.5l1.5-1.5" />
  </Icon>
);
export const ThermometerIcon = (p: P) => (
  <Icon {...p}>
    <path d="M10 14.5V5a2 2 0 0 1 4 0v9.5a4 4 0 1 1-4 0z" />
    <path d="M12 9v7.5" strokeWidth={3} />
  </Icon>
);
export const SnowIcon = (p: P) => (
  <Icon {...p}>
    <path d="M12 3v18M4.2 7.5l15.6 9M4.2 16.5l15.6-9M9.5 4.5L12 6.5l2.5-2M9.5 19.5L12 17.5l2.5 2" />
  </Icon>
);
export const HourglassIcon = (p: P) => (
  <Icon {...p}>
    <path d="M6.5 3.5h11M6.5 20.5h11M8 3.5c0 4.5 8 5 8 8.5s-8 4-8 8.5M16 3.5c0 4.5-8 5-8 8.5s8 4 8 8.5" />
  </Icon>
);
export const CameraIcon = (p: P) => (
  <Icon {...p}>
    <path d="M4 8h3l1.8-2.5h6.4L17 8h3v11H4z" />
    <circle cx="12" cy="13.3" r="3.5" />
  </Icon>
);
export const NoteIcon = (p: P) => (
  <Icon {...p}>
    <path d="M6 3.5h9l3.5 3.5v13.5H6z" />
    <path d="M9 11h6.5M9 14.5h6.5M9 18h4" />
  </Icon>
);
export const CalendarIcon = (p: P) => (
  <Icon {...p}>
    <rect x="4" y="5.5" width="16" height="15" rx="1.5" />
    <path d="M4 10h16M8.5 3.5v4M15.5 3.5v4" />
  </Icon>
);
export const CloseIcon = (p: P) => (
  <Icon {...p}>
    <path d="M6 6l12 12M18 6L6 18" strokeWidth={2.8} />
  </Icon>
);
export const ArrowLeftIcon = (p: P) => (
  <Icon {...p}>
    <path d="M20 12H5M10.5 6.5L5 12l5.5 5.5" strokeWidth={2.6} />
  </Icon>
);

/**
 * A glyph drawn once in `shared` for a meaning that is not a bay state (priority, a finding's
 * severity, the final check, idle), so the kiosk and the office draw the same one.
 */
export const MeaningGlyph = ({ name, ...p }: P & { name: MeaningIcon }) => (
  <Icon {...p}>
    {MEANING_ICON_PATHS[name].map((d) => (
      <path key={d} d={d} />
    ))}
  </Icon>
);
