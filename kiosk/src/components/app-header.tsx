import type { ReactNode } from 'react';
import { CONNECTION_WORDS } from '@baytime/shared';
import { Button } from '@fluentui/react-components';
import type { LinkState } from '@/lib/socket';
import { clockFace } from '@/lib/format';
import { useNow } from '@/hooks/use-now';
import { CloudOffIcon } from './icons';
import { BaytimeMark } from './baytime-mark';
import './app-header.css';

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
  const face = clockFace(now, timeZone);
  let date: string;
  try {
    date = new Intl.DateTimeFormat('en-US', {
      weekday: 'short',
      month: 'short',
      day: 'numeric',
      timeZone,
    }).format(now);
  } catch {
    date = new Intl.DateTimeFormat('en-US', { weekday: 'short', month: 'short', day: 'numeric' }).format(now);
  }
  return (
    <header className={`bt-header${nav ? ' bt-header--nav' : ''}`}>
      <div className="bt-header__shop">
        <BaytimeMark className="bt-header__mark" />
        {nav ?? <span className="bt-header__shop-name">{shopName}</span>}
      </div>
      <div className="bt-header__clock" aria-label="Time">
        <span className="bt-header__time">{face.time}</span>
        {face.period && <span className="bt-header__period">{face.period}</span>}
        <span className="bt-header__date">{date}</span>
      </div>
      <div className="bt-header__right">
        <span className={`bt-conn bt-conn--${connection}`} role="status">
          {connection === 'offline' ? <CloudOffIcon /> : <span className="bt-conn__dot" aria-hidden="true" />}
          {CONNECTION_WORDS[connection]}
        </span>
        {technicianName && (
          <>
            <span className="bt-header__tech">{technicianName}</span>
            <Button className="bt-header__signout" appearance="outline" size="large" onClick={onSignOut}>
              Sign out
            </Button>
          </>
        )}
      </div>
    </header>
  );
}
