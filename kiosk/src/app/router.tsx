import { createBrowserRouter, RouterProvider } from 'react-router';
import { paths } from '@/config/paths';
import { Splash } from '@/components/splash';
import { RootLayout } from './routes/root-layout';
import { RouteError } from './routes/route-error';
import { NotFound } from './routes/not-found';

const router = createBrowserRouter(
  [
    {
      Component: RootLayout,
      ErrorBoundary: RouteError,
      HydrateFallback: Splash,
      children: [
        {
          path: paths.signIn.path,
          ErrorBoundary: RouteError,
          lazy: async () => ({ Component: (await import('./routes/sign-in')).SignInRoute }),
        },
        {
          ErrorBoundary: RouteError,
          lazy: async () => ({ Component: (await import('./routes/signed-in-layout')).SignedInLayout }),
          children: [
            {
              path: paths.myDay.path,
              ErrorBoundary: RouteError,
              lazy: async () => ({ Component: (await import('./routes/my-day')).MyDayRoute }),
            },
            {
              path: paths.myWeek.path,
              ErrorBoundary: RouteError,
              lazy: async () => ({ Component: (await import('./routes/my-week')).MyWeekRoute }),
            },
          ],
        },
        { path: '*', Component: NotFound },
      ],
    },
  ],
  { basename: '/kiosk' },
);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
