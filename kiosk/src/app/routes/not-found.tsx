import { Link } from 'react-router';
import { paths } from '@/config/paths';
import { ScreenProblem } from '@/components/screen-problem';

export function NotFound() {
  return (
    <ScreenProblem title="Nothing here" message="This kiosk page does not exist.">
      <Link className="bt-action bt-action--go" to={paths.signIn.getHref()} replace>
        Back to the start
      </Link>
    </ScreenProblem>
  );
}
