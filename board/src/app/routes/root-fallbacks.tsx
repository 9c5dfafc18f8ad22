import { useEffect } from 'react';
import { isRouteErrorResponse, useLocation, useRouteError } from 'react-router';
import { paths } from '@/config/paths';

const HEALTH_POLL_MS = 20_000;

export function PageLoading() {
  // Read only: the wall must not flash a light page while its code loads.
  const onWall = typeof window !== 'undefined' && window.location.pathname.startsWith(paths.wall);
  return (
    <div className={onWall ? 'bt-fallback bt-fallback--dark' : 'bt-fallback'} role="status">
      Loading Baytime…
    </div>
  );
}

/**
 * Last line of defence. On the wall nobody is there to press a button: it waits until the server
 * answers its health check, then loads the page again.
 */
export function RootError() {
  const error = useRouteError();
  const { pathname } = useLocation();
  const onWall = pathname.startsWith(paths.wall);

  useEffect(() => {
    if (!onWall) return;
    const timer = setInterval(() => {
      fetch('/api/health', { cache: 'no-store' })
        .then((response) => {
          if (response.ok) window.location.reload();
        })
        .catch(() => undefined);
    }, HEALTH_POLL_MS);
    return () => clearInterval(timer);
  }, [onWall]);

  if (isRouteErrorResponse(error) && error.status === 404) {
    return (
      <main className="bt-fallback">
        <h1>Page not found</h1>
        <p>
          <a href={paths.home}>Go to the office</a> or <a href={paths.wall}>the wall board</a>.
        </p>
      </main>
    );
  }

  if (onWall) {
    return (
      <main className="bt-fallback bt-fallback--dark" role="alert">
        <h1>The board will be back in a moment</h1>
        <p>It restarts by itself as soon as the shop server answers.</p>
      </main>
    );
  }

  return (
    <main className="bt-fallback" role="alert">
      <h1>Something went wrong</h1>
      <p>Baytime could not show this page. Your work on the server is safe.</p>
      <button type="button" onClick={() => window.location.reload()}>
        Load the page again
      </button>
    </main>
  );
}
