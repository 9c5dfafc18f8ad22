import { useEffect, useState } from 'react';
import { isRouteErrorResponse, useNavigate, useRouteError } from 'react-router';
import { paths } from '@/config/paths';
import { ScreenProblem } from '@/components/screen-problem';
import {
  isModuleLoadError,
  loadFailure,
  probeModule,
  probeTarget,
  type ModuleProbe,
} from '@/lib/load-failure';

const WORDS = {
  updated: {
    title: 'The kiosk was updated',
    message: 'Reload to get the new version. Punches already tapped are kept.',
  },
  offline: {
    title: 'This screen is not on the tablet yet',
    message:
      'The kiosk cannot reach the shop’s server to fetch it. Check the Wi-Fi, then try again. Punches already tapped are kept.',
  },
  retry: {
    title: 'This screen did not load',
    message: 'Try again. Punches already tapped are kept.',
  },
} as const;

/** One per route branch: a broken screen offers a way back instead of a blank page. */
export function RouteError() {
  const error = useRouteError();
  const navigate = useNavigate();
  const [probe, setProbe] = useState<ModuleProbe | null>(null);
  useEffect(() => {
    if (!isModuleLoadError(error)) return;
    let current = true;
    void probeModule(probeTarget(error, import.meta.env.BASE_URL)).then((answer) => {
      if (current) setProbe(answer);
    });
    return () => {
      current = false;
    };
  }, [error]);

  const failure = loadFailure(error, probe);
  // The answer comes in a moment; saying nothing until then beats a message that may be wrong.
  if (failure === 'checking') return null;
  const message = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : error instanceof Error
      ? error.message
      : 'Something unexpected happened.';
  const words = failure === 'other' ? { title: 'This screen ran into a problem', message } : WORDS[failure];

  return (
    <ScreenProblem
      title={words.title}
      message={words.message}
      onRetry={() => window.location.reload()}
      retryLabel={failure === 'updated' ? 'Reload the kiosk' : 'Try again'}
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
