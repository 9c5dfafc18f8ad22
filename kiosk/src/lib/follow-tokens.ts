import { device } from './device';
import { queryClient } from './query-client';
import { queryKeys } from './query-keys';
import { session } from './session';
import { signedInHere } from './signed-in-here';
import { live } from './socket';

/**
 * While nobody is signed in the live link stays up on the tablet's own token from pairing, which
 * lasts until the office revokes it: timer chimes still come for everyone who signed in here, however
 * long ago their own sign-in ran out. That token reads the running timers and nothing of anyone's;
 * refused (the tablet was revoked), it is forgotten, the link drops, and with it the timers.
 */
export function followTokens(): () => void {
  const sync = () => {
    const current = session.get();
    if (current) {
      signedInHere.add(current.user, current.signedInAt);
      return;
    }
    // Whoever signs out, by tap, idle or a refused token: their own data goes.
    queryClient.removeQueries({ queryKey: queryKeys.me() });
    const token = device.token();
    if (token) live.connect(token, () => device.forget());
    else {
      live.disconnect();
      queryClient.removeQueries({ queryKey: queryKeys.timers() });
      queryClient.removeQueries({ queryKey: queryKeys.bays() });
    }
  };
  sync();
  const offSession = session.subscribe(sync);
  const offDevice = device.subscribe(() => {
    if (!session.get()) sync();
  });
  return () => {
    offSession();
    offDevice();
  };
}
