import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ClockFormat, ShopSettings, UnitSystem } from '@baytime/shared';
import { api } from '@/lib/api-client';
import { deviceApi } from '@/lib/device';
import { session } from '@/lib/session';
import { queryKeys } from '@/lib/query-keys';
import { setShopClockFormat } from '@/lib/shop-clock';

/**
 * The shop's name, time zone and units as last seen, so the keypad screen shows them (the shop's
 * clock, a timer banner's temperature) before anyone signs in. Nothing secret: the wall board
 * shows as much.
 */
export const REMEMBERED_SHOP_KEY = 'baytime.kiosk.shop';

export interface RememberedShop {
  name: string;
  timeZone: string;
  units?: UnitSystem;
  clockFormat?: ClockFormat;
}

/** As the technician when one is signed in, else as the paired tablet: the keypad shows shop time too. */
export async function getShop(): Promise<ShopSettings> {
  const shop = await (session.get() ? api : deviceApi).get<ShopSettings>('/shop');
  setShopClockFormat(shop.clockFormat);
  try {
    localStorage.setItem(
      REMEMBERED_SHOP_KEY,
      JSON.stringify({
        name: shop.name,
        timeZone: shop.timeZone,
        units: shop.units,
        clockFormat: shop.clockFormat,
      }),
    );
  } catch {
    // only a nicety
  }
  return shop;
}

export const shopQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.shop(), queryFn: getShop, staleTime: 10 * 60_000 });

export function useShop(enabled = true) {
  return useQuery({ ...shopQueryOptions(), enabled });
}

export function rememberedShop(): RememberedShop | null {
  try {
    const parsed = JSON.parse(
      localStorage.getItem(REMEMBERED_SHOP_KEY) ?? 'null',
    ) as Partial<RememberedShop> | null;
    if (typeof parsed?.name !== 'string' || typeof parsed.timeZone !== 'string') return null;
    const units = parsed.units === 'us' || parsed.units === 'metric' ? parsed.units : undefined;
    const clockFormat =
      parsed.clockFormat === '24h' || parsed.clockFormat === '12h' ? parsed.clockFormat : undefined;
    setShopClockFormat(clockFormat);
    return {
      name: parsed.name,
      timeZone: parsed.timeZone,
      ...(units && { units }),
      ...(clockFormat && { clockFormat }),
    };
  } catch {
    return null;
  }
}
