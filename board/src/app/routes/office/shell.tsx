import { Suspense, useEffect, useSyncExternalStore } from 'react';
import { Navigate, NavLink, Outlet, useLocation, useMatches, useNavigate } from 'react-router';
import {
  Button,
  Caption1,
  FluentProvider,
  CounterBadge,
  Link,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Spinner,
  Text,
  Toast,
  ToastTitle,
  Toaster,
  makeStyles,
  mergeClasses,
  shorthands,
  tokens,
  useId,
  useToastController,
} from '@fluentui/react-components';
import { ApiError } from '@baytime/shared/client';
import { WALL_BACKGROUND, type AuthUser } from '@baytime/shared';
import { paths } from '@/config/paths';
import { navFor, type OfficeRole } from '@/config/office-nav';
import { BaytimeMark } from '@/components/baytime-mark';
import { HEADING_FONT, baytimeRailTheme } from '@/lib/theme';
import { useMe } from '@/features/auth/api/get-me';
import { isOfficeRole } from '@/features/auth/api/login';
import { SignInEndNotice } from '@/features/auth/components/sign-in-end-notice';
import { useOfficeToken } from '@/features/auth/hooks/use-office-token';
import { useSignInRenewal } from '@/features/auth/hooks/use-sign-in-renewal';
import { useSignOut } from '@/features/auth/hooks/use-sign-out';
import { useShop } from '@/features/shop/api/get-shop';
import { useLiveQueries } from '@/hooks/use-live-queries';
import { findingArrivals } from '@/lib/finding-arrivals';
import { useOfficeEvent } from '@/lib/socket';
import type { OfficeHandle } from '../../router';

const ROLE_LABELS: Record<OfficeRole, string> = {
  owner: 'Owner',
  foreman: 'Foreman',
  advisor: 'Service advisor',
};

const useStyles = makeStyles({
  frame: {
    display: 'grid',
    gridTemplateColumns: '15rem minmax(0, 1fr)',
    minHeight: '100vh',
    '@media (max-width: 900px)': { gridTemplateColumns: 'minmax(0, 1fr)' },
    // On paper the page's content takes the whole width: the menu rail is screen chrome.
    '@media print': { display: 'block', minHeight: 0 },
  },
  // The rail is the wall's dark surface in either scheme, through Fluent's dark theme.
  rail: {
    position: 'sticky',
    top: 0,
    height: '100vh',
    backgroundColor: WALL_BACKGROUND,
    '@media (max-width: 900px)': { position: 'static', height: 'auto' },
    '@media print': { display: 'none' },
  },
  side: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalXL,
    height: '100%',
    padding: `${tokens.spacingVerticalXL} ${tokens.spacingHorizontalM}`,
    boxSizing: 'border-box',
    overflowY: 'auto',
    '@media (max-width: 900px)': {
      height: 'auto',
      flexDirection: 'row',
      flexWrap: 'wrap',
      alignItems: 'center',
      gap: tokens.spacingHorizontalL,
    },
  },
  brand: {
    display: 'flex',
    alignItems: 'center',
    gap: tokens.spacingHorizontalS,
    paddingLeft: tokens.spacingHorizontalXS,
    fontFamily: HEADING_FONT,
    fontSize: '26px',
    fontWeight: 700,
    lineHeight: 1,
    color: tokens.colorNeutralForeground1,
  },
  nav: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalL,
    flexGrow: 1,
    '@media (max-width: 900px)': { flexDirection: 'row', flexWrap: 'wrap' },
  },
  group: {
    display: 'flex',
    flexDirection: 'column',
    gap: '2px',
    '@media (max-width: 900px)': { flexDirection: 'row', flexWrap: 'wrap' },
  },
  groupLabel: {
    margin: `0 ${tokens.spacingHorizontalS} ${tokens.spacingVerticalXS}`,
    paddingTop: tokens.spacingVerticalS,
    ...shorthands.borderTop(tokens.strokeWidthThin, 'solid', tokens.colorNeutralStroke2),
    fontFamily: HEADING_FONT,
    fontSize: '15px',
    fontWeight: 600,
    color: tokens.colorNeutralForeground3,
    '@media (max-width: 900px)': { display: 'none' },
  },
  link: {
    display: 'flex',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: tokens.spacingHorizontalS,
    padding: `7px ${tokens.spacingHorizontalM}`,
    borderRadius: tokens.borderRadiusLarge,
    color: tokens.colorNeutralForeground2,
    textDecorationLine: 'none',
    fontFamily: HEADING_FONT,
    fontSize: '19px',
    fontWeight: 600,
    ':hover': { backgroundColor: tokens.colorNeutralBackground1Hover, color: tokens.colorNeutralForeground1 },
    ':focus-visible': { outline: `2px solid ${tokens.colorStrokeFocus2}`, outlineOffset: '1px' },
  },
  // The page you are on: a raised tile with a brand bar, like the kiosk's selected line.
  active: {
    backgroundColor: tokens.colorNeutralBackground1,
    color: tokens.colorNeutralForeground1,
    boxShadow: `inset 4px 0 0 ${tokens.colorBrandForeground1}`,
    ':hover': { backgroundColor: tokens.colorNeutralBackground1Hover },
  },
  coming: {
    padding: '0 6px',
    ...shorthands.border(tokens.strokeWidthThin, 'dashed', tokens.colorNeutralStroke1),
    borderRadius: tokens.borderRadiusMedium,
    fontFamily: tokens.fontFamilyBase,
    fontSize: tokens.fontSizeBase200,
    fontWeight: tokens.fontWeightRegular,
    color: tokens.colorNeutralForeground3,
  },
  user: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalXS,
    paddingLeft: tokens.spacingHorizontalS,
    color: tokens.colorNeutralForeground1,
  },
  role: { color: tokens.colorNeutralForeground3 },
  main: { minWidth: 0, padding: `${tokens.spacingVerticalXXL} ${tokens.spacingHorizontalXXL}` },
  centre: { display: 'grid', placeItems: 'center', minHeight: '60vh', padding: tokens.spacingHorizontalXL },
  notice: { maxWidth: '36rem', display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
});

export function Component() {
  const styles = useStyles();
  const token = useOfficeToken();
  const location = useLocation();
  const me = useMe(token !== null);
  const signOut = useSignOut();

  if (!token) return <Navigate to={paths.signIn} replace state={{ from: location.pathname }} />;
  if (me.isPending)
    return (
      <div className={styles.centre}>
        <Spinner label="Opening the office…" />
      </div>
    );
  if (me.isError) {
    const network = me.error instanceof ApiError && me.error.isNetwork;
    return (
      <div className={styles.centre}>
        <div className={styles.notice}>
          <MessageBar intent="error">
            <MessageBarBody>
              <MessageBarTitle>
                {network ? 'No connection to the shop server' : 'Could not open the office'}
              </MessageBarTitle>
              {network
                ? 'Check the network; Baytime tries again when you press the button.'
                : me.error.message}
            </MessageBarBody>
          </MessageBar>
          <div>
            <Button appearance="primary" onClick={() => void me.refetch()}>
              Try again
            </Button>{' '}
            <Button onClick={signOut}>Sign out</Button>
          </div>
        </div>
      </div>
    );
  }
  if (!isOfficeRole(me.data.role)) return <WrongApp user={me.data} onSignOut={signOut} />;
  return <Shell user={me.data} role={me.data.role} onSignOut={signOut} />;
}

function WrongApp({ user, onSignOut }: { user: AuthUser; onSignOut: () => void }) {
  const styles = useStyles();
  const kiosk = user.role === 'technician';
  return (
    <div className={styles.centre}>
      <div className={styles.notice}>
        <MessageBar intent="warning" layout="multiline">
          <MessageBarBody>
            <MessageBarTitle>{kiosk ? 'Use the kiosk' : 'This is a wall screen'}</MessageBarTitle>
            {kiosk ? (
              <>
                Technicians clock on and off at the <Link href={paths.kiosk}>shop kiosk</Link> with their
                badge and PIN.
              </>
            ) : (
              <>
                A paired screen shows the <Link href={paths.wall}>wall board</Link>; the office needs an
                office account.
              </>
            )}
          </MessageBarBody>
        </MessageBar>
        <div>
          <Button onClick={onSignOut}>Sign out</Button>
        </div>
      </div>
    </div>
  );
}

function Shell({ user, role, onSignOut }: { user: AuthUser; role: OfficeRole; onSignOut: () => void }) {
  const styles = useStyles();
  const matches = useMatches();
  const allowed = (matches.at(-1)?.handle as OfficeHandle | undefined)?.roles;
  const permitted = !allowed || allowed.includes(role);
  const groups = navFor(role);
  const arrived = useSyncExternalStore(findingArrivals.subscribe, findingArrivals.get).size;
  const toasterId = useId('office-toaster');
  const { dispatchToast } = useToastController(toasterId);
  const navigate = useNavigate();
  const { pathname } = useLocation();
  const timeZone = useShop().data?.timeZone;
  useLiveQueries();
  useSignInRenewal();
  // A finding reaches the advisor on whatever page they are: counted on the menu, and a toast.
  useOfficeEvent('finding.created', ({ findingId }) => {
    findingArrivals.add(findingId);
    if (pathname === paths.findings) return;
    dispatchToast(
      <Toast>
        <ToastTitle action={<Link onClick={() => navigate(paths.findings)}>Open findings</Link>}>
          A technician sent a finding
        </ToastTitle>
      </Toast>,
      { intent: 'info' },
    );
  });

  useEffect(() => {
    document.title = 'Baytime office';
  }, []);

  return (
    <div className={styles.frame}>
      <Toaster toasterId={toasterId} position="top-end" />
      <FluentProvider theme={baytimeRailTheme} className={styles.rail}>
        <aside className={styles.side}>
          <div className={styles.brand}>
            <BaytimeMark size={34} />
            Baytime
          </div>
          <nav className={styles.nav} aria-label="Office">
            {groups.map((group, index) => (
              <div key={group.label ?? index} className={styles.group}>
                {group.label && <Caption1 className={styles.groupLabel}>{group.label}</Caption1>}
                {group.entries.map((entry) => (
                  <NavLink
                    key={entry.path}
                    to={entry.path}
                    className={({ isActive }) => mergeClasses(styles.link, isActive && styles.active)}
                  >
                    {entry.label}
                    {entry.path === paths.findings && arrived > 0 && (
                      <CounterBadge count={arrived} size="small" aria-label={`${arrived} new`} />
                    )}
                    {entry.coming && <span className={styles.coming}>coming</span>}
                  </NavLink>
                ))}
              </div>
            ))}
          </nav>
          <div className={styles.user}>
            <Text weight="semibold">{user.name}</Text>
            <Caption1 className={styles.role}>{ROLE_LABELS[role]}</Caption1>
            <div>
              <Button size="small" onClick={onSignOut}>
                Sign out
              </Button>
            </div>
          </div>
        </aside>
      </FluentProvider>
      <main className={styles.main}>
        <SignInEndNotice user={user} timeZone={timeZone} />
        {permitted ? (
          <Suspense fallback={<Spinner />}>
            <Outlet context={{ user, role }} />
          </Suspense>
        ) : (
          <MessageBar intent="info">
            <MessageBarBody>
              <MessageBarTitle>Not part of your role</MessageBarTitle>
              This page is for the{' '}
              {allowed?.map((r) => ROLE_LABELS[r as OfficeRole]?.toLowerCase() ?? r).join(' or ')}. Your menu
              shows what you can open.
            </MessageBarBody>
          </MessageBar>
        )}
      </main>
    </div>
  );
}
