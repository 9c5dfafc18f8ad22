import { useEffect, type ReactNode } from 'react';
import { FluentProvider } from '@fluentui/react-components';
import { QueryClientProvider } from '@tanstack/react-query';
import { queryClient } from '@/lib/query-client';
import { session } from '@/lib/session';
import { listenToken } from '@/lib/listen-token';
import { signedInHere } from '@/lib/signed-in-here';
import { live } from '@/lib/socket';
import { installAudioUnlock } from '@/lib/chime';
import { setBeforeCommand } from '@/lib/commands';
import { kick, startPunchQueue } from '@/features/punches/punch-queue';
import { startQueueReports } from '@/features/punches/queue-report';
import { kioskTheme } from './theme';
import { queryKeys } from '@/lib/query-keys';

function invalidateMyDay() {
  void queryClient.invalidateQueries({ queryKey: queryKeys.myDay.all() });
}

/**
 * While nobody is signed in the live link stays up with the last technician's token, so timer
 * chimes still come for everyone who signed in here; without a valid token it drops, and with it
 * what only a token could fetch.
 */
function followTokens(): () => void {
  let lastToken = session.get()?.accessToken ?? null;
  const sync = () => {
    const current = session.get();
    if (current) {
      lastToken = current.accessToken;
      listenToken.set(current.accessToken);
      signedInHere.add(current.user, current.signedInAt);
      return;
    }
    if (lastToken && session.lastSignOutReason() === 'expired') listenToken.clear(lastToken);
    lastToken = null;
    // Whoever signs out, by tap, idle or a refused token: their own data goes.
    queryClient.removeQueries({ queryKey: queryKeys.me() });
    const token = listenToken.get();
    if (token) live.connect(token, () => listenToken.clear(token));
    else {
      live.disconnect();
      queryClient.removeQueries({ queryKey: queryKeys.timers() });
      queryClient.removeQueries({ queryKey: queryKeys.bays() });
    }
  };
  sync();
  const offSession = session.subscribe(sync);
  const offListen = listenToken.subscribe(() => {
    if (!session.get()) sync();
  });
  return () => {
    offSession();
    offListen();
  };
}

export function AppProvider({ children }: { children: ReactNode }) {
  useEffect(() => startPunchQueue({ onSent: invalidateMyDay, onRefused: invalidateMyDay }), []);
  useEffect(() => setBeforeCommand(kick), []);
  useEffect(startQueueReports, []);
  useEffect(installAudioUnlock, []);
  useEffect(followTokens, []);

  return (
    <QueryClientProvider client={queryClient}>
      <FluentProvider theme={kioskTheme} className="bt-fluent-root">
        {children}
      </FluentProvider>
    </QueryClientProvider>
  );
}
