import { lazy, Suspense, useState } from 'react';
import { NavLink, Outlet, useNavigation } from 'react-router';
import { paths } from '@/config/paths';
import { AppHeader } from '@/components/app-header';
import { CalendarIcon, DayIcon } from '@/components/icons';
import { useSession, session } from '@/lib/session';
import { useDeviceToken } from '@/lib/device';
import { useLiveQueries } from '@/hooks/use-live-queries';
import { rememberedShop, useShop } from '@/features/shop/api/get-shop';
import { useConnectionState } from '@/features/connection/hooks/use-connection-state';
import { OutboxStatus } from '@/features/punches/components/outbox-status';
import { PunchNotices } from '@/features/punches/components/punch-notices';
import '../app.css';

// Neither has anything to show before the keypad paints: the service worker's prompt waits for a newer
// build, the timer alerts for the timers to be fetched.
const UpdatePrompt = lazy(async () => ({
  default: (await import('@/features/app-update/components/update-prompt')).UpdatePrompt,
}));
const TimerAlertBanner = lazy(async () => ({
  default: (await import('@/features/timers/components/timer-alert-banner')).TimerAlertBanner,
}));

export function RootLayout() {
  const current = useSession();
  useLiveQueries(current?.user.id ?? null);
  const paired = useDeviceToken() !== null;
  const shop = useShop(current !== null || paired);
  const [remembered] = useState(rememberedShop);
  const connection = useConnectionState(current !== null);
  const navigation = useNavigation();
  const timeZone = shop.data?.timeZone ?? remembered?.timeZone;

  return (
    <div className="bt-app">
      <AppHeader
        shopName={shop.data?.name ?? remembered?.name ?? 'Baytime'}
        timeZone={timeZone}
        connection={connection}
        technicianName={current?.user.name}
        onSignOut={() => session.clear('tapped')}
        nav={
          current && (
            <nav className="bt-header__nav" aria-label="Kiosk pages">
              <NavLink to={paths.myDay.getHref()} className="bt-header__tab">
                <DayIcon /> My day
              </NavLink>
              <NavLink to={paths.myWeek.getHref()} className="bt-header__tab">
                <CalendarIcon /> My week
              </NavLink>
            </nav>
          )
        }
      />
      <Suspense fallback={null}>
        <UpdatePrompt />
      </Suspense>
      <OutboxStatus />
      <PunchNotices technicianId={current?.user.id} />
      <Suspense fallback={null}>
        <TimerAlertBanner units={shop.data?.units ?? remembered?.units} timeZone={timeZone} />
      </Suspense>
      <main className="bt-app__main" aria-busy={navigation.state === 'loading'}>
        <Outlet />
      </main>
    </div>
  );
}
