import { Navigate, useNavigate } from 'react-router';
import { paths } from '@/config/paths';
import { session, useSession, useSignOutReason, type SignOutReason } from '@/lib/session';
import { SignInPanel } from '@/features/auth/components/sign-in-panel';
import { renewQueuedToken } from '@/features/punches/punch-queue';

const REASONS: Record<SignOutReason, string> = {
  tapped: 'Signed out. Next person: badge number, then PIN.',
  idle: 'Signed out after a while without a touch, so the next person starts fresh.',
  expired: 'Your sign-in ran out. Sign in again; nothing you tapped is lost.',
};

export function SignInRoute() {
  const current = useSession();
  const reason = useSignOutReason();
  const navigate = useNavigate();
  if (current) return <Navigate to={paths.myDay.getHref()} replace />;

  return (
    <SignInPanel
      notice={reason ? REASONS[reason] : null}
      onNoticeSeen={session.forgetSignOutReason}
      onSignedIn={({ accessToken, user }) => {
        session.set(accessToken, user);
        renewQueuedToken(user.id, accessToken);
        void navigate(paths.myDay.getHref(), { replace: true });
      }}
    />
  );
}
