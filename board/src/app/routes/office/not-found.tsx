import { Body1 } from '@fluentui/react-components';
import { Link } from 'react-router';
import { PageHeader } from '@/components/page-header';
import { paths } from '@/config/paths';

export function Component() {
  return (
    <>
      <PageHeader title="Page not found" />
      <Body1>
        There is no page at this address. <Link to={paths.floor}>Back to the floor</Link>
      </Body1>
    </>
  );
}
