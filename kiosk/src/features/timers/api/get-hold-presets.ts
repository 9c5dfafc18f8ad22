import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HoldPresetDto } from '@baytime/shared';
import { api } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** `GET /api/hold-presets`: the owner's fixed holds (sealant cure, vacuum hold…). */
export const getHoldPresets = () => api.get<HoldPresetDto[]>('/hold-presets');

export const holdPresetsQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.holdPresets(), queryFn: getHoldPresets, staleTime: 5 * 60_000 });

export function useHoldPresets() {
  return useQuery(holdPresetsQueryOptions());
}
