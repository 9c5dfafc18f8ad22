import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ShopSettings, UpdateShopBody } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { shopQueryOptions } from './get-shop';

export function updateShop(body: UpdateShopBody): Promise<ShopSettings> {
  return officeApi.patch<ShopSettings>('/shop', body);
}

export function useUpdateShop() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateShop,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: shopQueryOptions().queryKey }),
  });
}
