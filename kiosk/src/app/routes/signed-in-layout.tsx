import { useEffect } from 'react';
import { Navigate, Outlet } from 'react-router';
import { paths } from '@/config/paths';
import { session, useSession } from '@/lib/session';
import { live } from '@/lib/socket';
import { useMyDay } from '@/features/my-day/api/get-my-day';
import { useIdleSignOut } from '@/features/auth/hooks/use-idle-sign-out';
import { IdleWarning } from '@/features/auth/components/idle-warning';

const DEFAULT_IDLE_SECONDS = 60;

/** Everything behind the keypad: the live link, and the sign-out after a while without a touch. */
export function SignedInLayout() {
  const current = useSession();
  if (!current) return <Navigate to={paths.signIn.getHref()} replace />;
  return <SignedIn technicianId={current.user.id} token={current.accessToken} />;
}

function SignedIn({ technicianId, token }: { technicianId: number; token: string }) {
  const day = useMyDay(technicianId);
  const idleSeconds = day.data?.idleSignOutSeconds ?? DEFAULT_IDLE_SECONDS;
  const secondsLeft = useIdleSignOut(idleSeconds, () => session.clear('idle'));

  useEffect(() => {
    live.connect(token, () => session.clear('expired'));
  }, [token]);

  return (
    <>
      <Outlet />
      {secondsLeft !== null && <IdleWarning secondsLeft={secondsLeft} />}
    </>
  );
}
