import { queryOptions, useQuery } from '@tanstack/react-query';
import type { JobLineDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import type { JobLineRef } from '../timecard-model';

/** The part of a `GET /api/repair-orders` row a missed job punch needs. */
interface OpenRepairOrder {
  number: string;
  lines: Pick<JobLineDto, 'id' | 'lineNo' | 'title' | 'technicianId'>[];
}

/** Job lines on open repair orders, labelled like the card's own: "RO 4497 · title". */
export async function getOpenLines(): Promise<(JobLineRef & { technicianId: number | null })[]> {
  const orders = await officeApi.get<OpenRepairOrder[]>('/repair-orders?status=open');
  return orders.flatMap((order) =>
    order.lines.map((line) => ({
      jobLineId: line.id,
      label: `RO ${order.number} · ${line.title}`,
      technicianId: line.technicianId,
    })),
  );
}

export const openLinesQueryOptions = () =>
  queryOptions({ queryKey: ['timecard-open-lines'], queryFn: getOpenLines, staleTime: 60_000 });

export function useOpenLines(enabled: boolean) {
  return useQuery({ ...openLinesQueryOptions(), enabled });
}
