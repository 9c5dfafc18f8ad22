import { lazy, Suspense, useState } from 'react';
import { Navigate, useNavigate, useSearchParams } from 'react-router';
import { paths } from '@/config/paths';
import { useDeviceToken } from '@/lib/device';
import { session, useSession, useSignOutReason, type SignOutReason } from '@/lib/session';
import { SignInPanel } from '@/features/auth/components/sign-in-panel';
import { useConnectionState } from '@/features/connection/hooks/use-connection-state';
import { useOfflineKey } from '@/features/punches/api/get-offline-key';
import { OfflinePunchSheet } from '@/features/punches/components/offline-punch-sheet';
import { renewQueuedToken } from '@/features/punches/punch-queue';
import { rememberedShop } from '@/features/shop/api/get-shop';
import { Splash } from '@/components/splash';

// Shown once in a tablet's life: it loads by itself, and with it the zod schema it checks codes with.
const PairKioskPanel = lazy(async () => ({
  default: (await import('@/features/pairing/components/pair-kiosk-panel')).PairKioskPanel,
}));

const REASONS: Record<SignOutReason, string> = {
  tapped: 'Signed out. Next person: badge number, then PIN.',
  idle: 'Signed out after a while without a touch, so the next person starts fresh.',
  expired: 'Your sign-in ran out. Sign in again; nothing you tapped is lost.',
};

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
      )}
    </>
  );
}
