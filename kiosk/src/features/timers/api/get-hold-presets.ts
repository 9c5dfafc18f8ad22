import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HoldPresetDto } from '@baytime/shared';
import { api } from '@/lib/api-client';

/** `GET /api/hold-presets`: the owner's fixed holds (sealant cure, vacuum hold…). */
export const getHoldPresets = () => api.get<HoldPresetDto[]>('/hold-presets');

export const holdPresetsQueryOptions = () =>
  queryOptions({ queryKey: ['hold-presets'], queryFn: getHoldPresets, staleTime: 5 * 60_000 });

export function useHoldPresets() {
  return useQuery(holdPresetsQueryOptions());
}
