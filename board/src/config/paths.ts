/** Every route of the board app in one place. */
export const paths = {
  wall: '/wall',
  signIn: '/sign-in',
  /** The customer's approval page, from the link in the message: no sign-in. */
  approve: '/approve/:token',
  home: '/',
  floor: '/floor',
  dispatch: '/dispatch',
  repairOrders: '/repair-orders',
  repairOrderNew: '/repair-orders/new',
  repairOrderImport: '/repair-orders/import',
  repairOrderDetail: '/repair-orders/:id',
  repairOrder: (id: number | string) => `/repair-orders/${id}`,
  timecards: '/timecards',
  exceptions: '/exceptions',
  reports: '/reports',
  findings: '/findings',
  offlinePunches: '/offline-punches',
  admin: {
    users: '/admin/users',
    bays: '/admin/bays',
    operations: '/admin/operations',
    screens: '/admin/screens',
    kiosks: '/admin/kiosks',
    shop: '/admin/shop',
    mailbox: '/admin/mailbox',
    integrationKeys: '/admin/integration-keys',
    webhooks: '/admin/webhooks',
  },
  /** The technicians' app, served by the same server. */
  kiosk: '/kiosk/',
} as const;
