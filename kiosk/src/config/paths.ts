/** Every route of the kiosk, relative to the router's basename `/kiosk`. */
export const paths = {
  signIn: { path: '/', getHref: () => '/' },
  myDay: { path: '/day', getHref: () => '/day' },
} as const;
