import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ShopSettings } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export function getShop(): Promise<ShopSettings> {
  return officeApi.get<ShopSettings>('/shop');
}

export const shopQueryOptions = () => queryOptions({ queryKey: queryKeys.shop(), queryFn: getShop });

export function useShop() {
  return useQuery(shopQueryOptions());
}
