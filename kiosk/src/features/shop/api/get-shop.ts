import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ShopSettings } from '@baytime/shared';
import { api } from '@/lib/api-client';

/**
 * The shop's name and time zone as last seen, so the keypad screen shows them (and the shop's
 * clock) before anyone signs in. Nothing secret: both are on the wall board too.
 */
export const REMEMBERED_SHOP_KEY = 'baytime.kiosk.shop';

export interface RememberedShop {
  name: string;
  timeZone: string;
}

export async function getShop(): Promise<ShopSettings> {
  const shop = await api.get<ShopSettings>('/shop');
  try {
    localStorage.setItem(REMEMBERED_SHOP_KEY, JSON.stringify({ name: shop.name, timeZone: shop.timeZone }));
  } catch {
    // only a nicety
  }
  return shop;
}

export const shopQueryOptions = () =>
  queryOptions({ queryKey: ['shop'], queryFn: getShop, staleTime: 10 * 60_000 });

export function useShop(enabled = true) {
  return useQuery({ ...shopQueryOptions(), enabled });
}

export function rememberedShop(): RememberedShop | null {
  try {
    const parsed = JSON.parse(
      localStorage.getItem(REMEMBERED_SHOP_KEY) ?? 'null',
    ) as Partial<RememberedShop> | null;
    return typeof parsed?.name === 'string' && typeof parsed.timeZone === 'string'
      ? { name: parsed.name, timeZone: parsed.timeZone }
      : null;
  } catch {
    return null;
  }
}
