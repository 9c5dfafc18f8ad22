import { useState } from 'react';
import { Outlet, useNavigation } from 'react-router';
import { AppHeader } from '@/components/app-header';
import { useSession, session } from '@/lib/session';
import { rememberedShop, useShop } from '@/features/shop/api/get-shop';
import { useConnectionState } from '@/features/connection/hooks/use-connection-state';
import { OutboxStatus } from '@/features/punches/components/outbox-status';
import { PunchNotices } from '@/features/punches/components/punch-notices';
import '../app.css';

export function RootLayout() {
  const current = useSession();
  const shop = useShop(current !== null);
  const [remembered] = useState(rememberedShop);
  const connection = useConnectionState(current !== null);
  const navigation = useNavigation();

  return (
    <div className="bt-app">
      <AppHeader
        shopName={shop.data?.name ?? remembered?.name ?? 'Baytime'}
        timeZone={shop.data?.timeZone ?? remembered?.timeZone}
        connection={connection}
        technicianName={current?.user.name}
        onSignOut={() => session.clear('tapped')}
      />
      <OutboxStatus />
      <PunchNotices technicianId={current?.user.id} />
      <main className="bt-app__main" aria-busy={navigation.state === 'loading'}>
        <Outlet />
      </main>
    </div>
  );
}
