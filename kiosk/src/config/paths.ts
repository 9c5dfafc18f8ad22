/** Every route of the kiosk, relative to the router's basename `/kiosk`. */
export const paths = {
  signIn: { path: '/', getHref: () => '/' },
  myDay: { path: '/day', getHref: () => '/day' },
  /** `week` is an ISO week label, `2026-W48`; without it, the current workweek. */
  myWeek: {
    path: '/week',
    getHref: (week?: string) => (week ? `/week?week=${encodeURIComponent(week)}` : '/week'),
  },
} as const;
