/** Every route of the board app in one place. */
export const paths = {
  wall: '/wall',
  signIn: '/sign-in',
  home: '/',
  floor: '/floor',
  dispatch: '/dispatch',
  repairOrders: '/repair-orders',
  timecards: '/timecards',
  reports: '/reports',
  admin: {
    users: '/admin/users',
    bays: '/admin/bays',
    screens: '/admin/screens',
    shop: '/admin/shop',
  },
  /** The technicians' app, served by the same server. */
  kiosk: '/kiosk/',
} as const;
