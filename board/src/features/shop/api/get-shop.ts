import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ShopSettings } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { setShopClockFormat } from '@/lib/shop-clock';

export async function getShop(): Promise<ShopSettings> {
  const shop = await officeApi.get<ShopSettings>('/shop');
  setShopClockFormat(shop.clockFormat);
  return shop;
}

export const shopQueryOptions = () => queryOptions({ queryKey: queryKeys.shop(), queryFn: getShop });

export function useShop() {
  return useQuery(shopQueryOptions());
}
