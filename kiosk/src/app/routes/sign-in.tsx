import { lazy, Suspense, useState } from 'react';
import { Navigate, useNavigate, useSearchParams } from 'react-router';
import { paths } from '@/config/paths';
import { useDeviceToken } from '@/lib/device';
import { session, useSession, useSignOutReason, type SignOutReason } from '@/lib/session';
import { SignInPanel } from '@/features/auth/components/sign-in-panel';
import { useConnectionState } from '@/features/connection/hooks/use-connection-state';
import { useOfflineKey } from '@/features/punches/api/get-offline-key';
import { renewQueuedToken } from '@/features/punches/punch-queue';
import { rememberedShop } from '@/features/shop/api/get-shop';
import { Splash } from '@/components/splash';
import { usePreload } from '@/hooks/use-preload';
import { SheetLoading } from '@/components/sheet-loading';

// Shown once in a tablet's life: it loads by itself, and with it the zod schema it checks codes with.
const PairKioskPanel = lazy(async () => ({
  default: (await import('@/features/pairing/components/pair-kiosk-panel')).PairKioskPanel,
}));
// Needed only when the server cannot be reached, so it is fetched ahead once the keypad shows.
const loadOfflinePunchSheet = () => import('@/features/punches/components/offline-punch-sheet');
const OfflinePunchSheet = lazy(() => loadOfflinePunchSheet().then((m) => ({ default: m.OfflinePunchSheet })));
const PRELOADS = [loadOfflinePunchSheet];

const REASONS: Record<SignOutReason, string> = {
  tapped: 'Signed out. Next person: badge number, then PIN.',
  idle: 'Signed out after a while without a touch, so the next person starts fresh.',
  expired: 'Your sign-in ran out. Sign in again; nothing you tapped is lost.',
};

const LINK_BACK = 'The connection is back. Sign in with your badge as usual.';

export function SignInRoute() {
  const paired = useDeviceToken() !== null;
  const [params] = useSearchParams();
  if (!paired)
    return (
      <Suspense fallback={<Splash />}>
        <PairKioskPanel codeFromAddress={params.get('code')} />
      </Suspense>
    );
  return <SignIn />;
}

function SignIn() {
  const current = useSession();
  const reason = useSignOutReason();
  const navigate = useNavigate();
  const connection = useConnectionState(false);
  useOfflineKey(connection !== 'offline');
  const [offlineFor, setOfflineFor] = useState<{ badge: string; pin: string } | null>(null);
  const [recorded, setRecorded] = useState<string | null>(null);
  // The link is back: the offline punch sheet no longer applies, so it closes and says so.
  const online = connection === 'online';
  const [wasOnline, setWasOnline] = useState(online);
  if (online !== wasOnline) {
    setWasOnline(online);
    if (online && offlineFor) {
      setOfflineFor(null);
      setRecorded(LINK_BACK);
    }
  }
  usePreload(PRELOADS);
  if (current) return <Navigate to={paths.myDay.getHref()} replace />;

  return (
    <>
      <SignInPanel
        notice={recorded ?? (reason ? REASONS[reason] : null)}
        onNoticeSeen={() => {
          setRecorded(null);
          session.forgetSignOutReason();
        }}
        offline={connection === 'offline'}
        onOffline={(badge, pin) => setOfflineFor({ badge, pin })}
        onSignedIn={({ accessToken, user }) => {
          session.set(accessToken, user);
          renewQueuedToken(user.id, accessToken);
          void navigate(paths.myDay.getHref(), { replace: true });
        }}
      />
      {offlineFor && (
        <Suspense fallback={<SheetLoading />}>
          <OfflinePunchSheet
            badge={offlineFor.badge}
            pin={offlineFor.pin}
            timeZone={rememberedShop()?.timeZone}
            onClose={() => setOfflineFor(null)}
            onDone={(message) => {
              setOfflineFor(null);
              setRecorded(message);
            }}
          />
        </Suspense>
      )}
    </>
  );
}
