import { useEffect, type ReactNode } from 'react';
import { FluentProvider } from '@fluentui/react-components';
import { QueryClientProvider } from '@tanstack/react-query';
import { queryClient } from '@/lib/query-client';
import { session } from '@/lib/session';
import { live } from '@/lib/socket';
import { myDayRootKey } from '@/features/my-day/api/get-my-day';
import { startPunchQueue } from '@/features/punches/punch-queue';
import { kioskTheme } from './theme';

function invalidateMyDay() {
  void queryClient.invalidateQueries({ queryKey: myDayRootKey });
}

export function AppProvider({ children }: { children: ReactNode }) {
  useEffect(() => startPunchQueue({ onSent: invalidateMyDay, onRefused: invalidateMyDay }), []);

  // Whoever signs out, by tap, idle or a refused token: drop their live link and their data.
  useEffect(
    () =>
      session.subscribe(() => {
        if (session.get()) return;
        live.disconnect();
        queryClient.removeQueries({ queryKey: ['me'] });
      }),
    [],
  );

  return (
    <QueryClientProvider client={queryClient}>
      <FluentProvider theme={kioskTheme} className="bt-fluent-root">
        {children}
      </FluentProvider>
    </QueryClientProvider>
  );
}
