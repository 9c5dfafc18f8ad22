import { useEffect, type ReactNode } from 'react';
import { FluentProvider } from '@fluentui/react-components';
import { QueryClientProvider } from '@tanstack/react-query';
import { queryClient } from '@/lib/query-client';
import { followTokens } from '@/lib/follow-tokens';
import { installAudioUnlock } from '@/lib/chime';
import { setBeforeCommand } from '@/lib/commands';
import { kick, startPunchQueue } from '@/features/punches/punch-queue';
import { startQueueReports } from '@/features/punches/queue-report';
import { kioskTheme } from './theme';
import { queryKeys } from '@/lib/query-keys';

function invalidateMyDay() {
  void queryClient.invalidateQueries({ queryKey: queryKeys.myDay.all() });
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
