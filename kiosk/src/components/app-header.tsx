import { lazy, Suspense, type ReactNode } from 'react';
import { CONNECTION_WORDS } from '@baytime/shared';
import type { LinkState } from '@/lib/socket';
import { clockFace, shortDate } from '@/lib/format';
import { useNow } from '@/hooks/use-now';
import { CloudOffIcon } from './icons';
import { BaytimeMark } from './baytime-mark';
import './app-header.css';

// Fluent's button is needed only once someone is signed in: it loads then, not before the keypad shows.
const SignOutButton = lazy(async () => ({ default: (await import('./sign-out-button')).SignOutButton }));

export interface AppHeaderProps {
  shopName: string;
  timeZone?: string;
  connection: LinkState;
  technicianName?: string;
  onSignOut?: () => void;
  /** Links between the signed-in pages; they take the shop name's place. */
  nav?: ReactNode;
}

export function AppHeader({
  shopName,
  timeZone,
  connection,
  technicianName,
  onSignOut,
  nav,
}: AppHeaderProps) {
  const now = useNow(1000);
  const face = timeZone ? clockFace(now, timeZone) : null;
  return (
    <header className={`bt-header${nav ? ' bt-header--nav' : ''}`}>
      <div className="bt-header__shop">
        <BaytimeMark className="bt-header__mark" />
        {nav ?? <span className="bt-header__shop-name">{shopName}</span>}
      </div>
      {/* Shop time only: a tablet not yet paired does not know the shop's zone, and shows no clock. */}
      {face && timeZone ? (
        <div className="bt-header__clock" aria-label="Time">
          <span className="bt-header__time">{face.time}</span>
          {face.period && <span className="bt-header__period">{face.period}</span>}
          <span className="bt-header__date">{shortDate(now, timeZone)}</span>
        </div>
      ) : (
        <div className="bt-header__clock" />
      )}
      <div className="bt-header__right">
        <span className={`bt-conn bt-conn--${connection}`} role="status">
          {connection === 'offline' ? <CloudOffIcon /> : <span className="bt-conn__dot" aria-hidden="true" />}
          {CONNECTION_WORDS[connection]}
        </span>
        {technicianName && (
          <>
            <span className="bt-header__tech">{technicianName}</span>
            <Suspense fallback={null}>
              <SignOutButton onClick={onSignOut} />
            </Suspense>
          </>
        )}
      </div>
    </header>
  );
}
