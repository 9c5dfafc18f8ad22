import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ShopSettings } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

export function getShop(): Promise<ShopSettings> {
  return officeApi.get<ShopSettings>('/shop');
}

export const shopQueryOptions = () => queryOptions({ queryKey: ['shop'], queryFn: getShop });

export function useShop() {
  return useQuery(shopQueryOptions());
}
