import { queryOptions, useQuery } from '@tanstack/react-query';
import type { KnownVehicle } from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { officeApi } from '@/lib/api-client';

/** The vehicle with this VIN, its owner and last visit; null when the shop has not seen it. */
export async function getKnownVehicle(vin: string): Promise<KnownVehicle | null> {
  try {
    return await officeApi.get<KnownVehicle>(`/vehicles?vin=${encodeURIComponent(vin)}`);
  } catch (error) {
    if (error instanceof ApiError && error.status === 404) return null;
    throw error;
  }
}

export const knownVehicleQueryOptions = (vin: string) =>
  queryOptions({ queryKey: ['vehicle', vin], queryFn: () => getKnownVehicle(vin), staleTime: 60_000 });

/** Asks once `vin` is set: a whole VIN, or one the advisor is about to save with a reason. */
export function useKnownVehicle(vin: string | null) {
  return useQuery({ ...knownVehicleQueryOptions(vin ?? ''), enabled: vin !== null });
}
