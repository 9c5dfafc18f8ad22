import { PageHeader } from '@/components/page-header';
import { ShopSettingsForm } from '@/features/shop/components/shop-settings-form';

export function Component() {
  return (
    <>
      <PageHeader title="Shop settings" description="How the shop keeps time and pays its technicians." />
      <ShopSettingsForm />
    </>
  );
}
