import { Button } from '@fluentui/react-components';

export function SignOutButton({ onClick }: { onClick?: () => void }) {
  return (
    <Button className="bt-header__signout" appearance="outline" size="large" onClick={onClick}>
      Sign out
    </Button>
  );
}
