import { isRouteErrorResponse, useNavigate, useRouteError } from 'react-router';
import { paths } from '@/config/paths';
import { ScreenProblem } from '@/components/screen-problem';

/** One per route branch: a broken screen offers a way back instead of a blank page. */
export function RouteError() {
  const error = useRouteError();
  const navigate = useNavigate();
  const message = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : error instanceof Error
      ? error.message
      : 'Something unexpected happened.';
  const stale =
    error instanceof Error && /dynamically imported module|Importing a module script/i.test(error.message);

  return (
    <ScreenProblem
      title={stale ? 'The kiosk was updated' : 'This screen ran into a problem'}
      message={stale ? 'Reload to get the new version. Punches already tapped are kept.' : message}
      onRetry={() => window.location.reload()}
      retryLabel="Reload the kiosk"
    >
      <button
        type="button"
        className="bt-action bt-action--quiet"
        onClick={() => void navigate(paths.signIn.getHref(), { replace: true })}
      >
        Back to the start
      </button>
    </ScreenProblem>
  );
}
