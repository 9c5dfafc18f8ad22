import { queryOptions, useQuery } from '@tanstack/react-query';
import { officeApi } from '@/lib/api-client';

/** The fields of `GET /api/repair-orders` the intake reads to recognise a returning vehicle. */
export interface KnownVisit {
  number: string;
  customerName: string;
  vehicle: string;
  vin: string;
  odometer: number;
  createdAt: string;
}

export function getKnownVisits(): Promise<KnownVisit[]> {
  return officeApi.get<KnownVisit[]>('/repair-orders');
}

/** Same key and address as the repair-order list's "all", so the two share one cache entry. */
export const knownVisitsQueryOptions = () =>
  queryOptions({ queryKey: ['repair-orders', 'all'], queryFn: getKnownVisits, staleTime: 60_000 });

export function useKnownVisits() {
  return useQuery(knownVisitsQueryOptions());
}
