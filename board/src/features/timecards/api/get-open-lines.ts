import { queryOptions, useQuery } from '@tanstack/react-query';
import type { JobLineDto, Page } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import type { JobLineRef } from '../timecard-model';

/** The part of a `GET /api/repair-orders` row a missed job punch needs. */
interface OpenRepairOrder {
  number: string;
  lines: Pick<JobLineDto, 'id' | 'lineNo' | 'title' | 'technicianId'>[];
}

/** Every open repair order, page after page: the work on the floor now, not the shop's history. */
async function getOpenRepairOrders(): Promise<OpenRepairOrder[]> {
  const orders: OpenRepairOrder[] = [];
  let cursor: string | null = null;
  do {
    const page: Page<OpenRepairOrder> = await officeApi.get<Page<OpenRepairOrder>>(
      `/repair-orders?status=open&limit=100${cursor ? `&cursor=${cursor}` : ''}`,
    );
    orders.push(...page.items);
    cursor = page.nextCursor;
  } while (cursor);
  return orders;
}

/** Job lines on open repair orders, labelled like the card's own: "RO 4497 · title". */
export async function getOpenLines(): Promise<(JobLineRef & { technicianId: number | null })[]> {
  const orders = await getOpenRepairOrders();
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
