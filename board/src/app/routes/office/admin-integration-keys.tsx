import { Link } from '@fluentui/react-components';
import { PageHeader } from '@/components/page-header';
import {
  CreateIntegrationKeyCard,
  IntegrationKeysTable,
} from '@/features/integration-keys/components/integration-keys-admin';
import { useShop } from '@/features/shop/api/get-shop';

export { PageError as ErrorBoundary } from './page-error';

export function Component() {
  const timeZone = useShop().data?.timeZone;
  return (
    <>
      <PageHeader
        title="Integration keys"
        description={
          <>
            Keys the shop’s other systems call the API with. Each can do only what its scopes allow and never
            signs in to the apps. The API is described in the <Link href="/api/docs">API reference</Link>.
          </>
        }
      />
      <CreateIntegrationKeyCard />
      <IntegrationKeysTable timeZone={timeZone} />
    </>
  );
}
