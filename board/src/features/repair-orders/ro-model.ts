import {
  HOLD_REASON_LABELS,
  shopDayKey,
  type DispatchBoard,
  type DispatchLine,
  type FindingDto,
  type JobLineDto,
  type RepairOrderStatus,
} from '@baytime/shared';
import type { RepairOrderSummary } from './api/get-repair-orders';

export const STATUS_FILTERS = ['all', 'open', 'done', 'closed'] as const;
export type StatusFilter = (typeof STATUS_FILTERS)[number];

export interface RepairOrderFilters {
  status: StatusFilter;
  /** An advisor's id as text; empty for everyone. */
  advisor: string;
  promisedToday: boolean;
  late: boolean;
  search: string;
}

export const DEFAULT_FILTERS: RepairOrderFilters = {
  status: 'open',
  advisor: '',
  promisedToday: false,
  late: false,
  search: '',
};

/** Filters kept in the address, so the list comes back as it was after opening an RO. */
export function filtersFromParams(params: URLSearchParams): RepairOrderFilters {
  const status = params.get('status');
  return {
    status: STATUS_FILTERS.includes(status as StatusFilter)
      ? (status as StatusFilter)
      : DEFAULT_FILTERS.status,
    advisor: params.get('advisor') ?? '',
    promisedToday: params.get('today') === '1',
    late: params.get('late') === '1',
    search: params.get('q') ?? '',
  };
}

export function filtersToParams(filters: RepairOrderFilters): URLSearchParams {
  const params = new URLSearchParams();
  if (filters.status !== DEFAULT_FILTERS.status) params.set('status', filters.status);
  if (filters.advisor) params.set('advisor', filters.advisor);
  if (filters.promisedToday) params.set('today', '1');
  if (filters.late) params.set('late', '1');
  if (filters.search.trim()) params.set('q', filters.search.trim());
  return params;
}

export function statusForServer(filter: StatusFilter): RepairOrderStatus | undefined {
  return filter === 'all' ? undefined : filter;
}

export function isPromisedToday(
  ro: Pick<RepairOrderSummary, 'promisedAt'>,
  nowMs: number,
  timeZone: string,
): boolean {
  return (
    ro.promisedAt !== null &&
    shopDayKey(new Date(ro.promisedAt), timeZone) === shopDayKey(new Date(nowMs), timeZone)
  );
}

/** Ids of open lines forecast to finish after their promised time. */
export function lateLineIds(dispatch: DispatchBoard | undefined): Set<number> {
  const ids = new Set<number>();
  if (!dispatch) return ids;
  for (const lane of dispatch.lanes) for (const line of lane.lines) if (line.forecast?.late) ids.add(line.id);
  return ids;
}

/** An open RO past its promised time, or with a line forecast to miss it. */
export function isLate(
  ro: Pick<RepairOrderSummary, 'status' | 'promisedAt' | 'lines'>,
  nowMs: number,
  lateLines: ReadonlySet<number>,
): boolean {
  if (ro.status !== 'open') return false;
  if (ro.promisedAt !== null && Date.parse(ro.promisedAt) < nowMs) return true;
  return ro.lines.some((line) => lateLines.has(line.id));
}

export interface FilterContext {
  nowMs: number;
  timeZone: string;
  lateLines: ReadonlySet<number>;
}

export function filterRepairOrders(
  list: readonly RepairOrderSummary[],
  filters: RepairOrderFilters,
  context: FilterContext,
): RepairOrderSummary[] {
  const words = filters.search.trim().toLowerCase().split(/\s+/).filter(Boolean);
  return list.filter((ro) => {
    if (filters.status !== 'all' && ro.status !== filters.status) return false;
    if (filters.advisor && String(ro.advisorId ?? '') !== filters.advisor) return false;
    if (filters.promisedToday && !isPromisedToday(ro, context.nowMs, context.timeZone)) return false;
    if (filters.late && !isLate(ro, context.nowMs, context.lateLines)) return false;
    if (words.length) {
      const text = [ro.number, ro.customerName, ro.vehicle, ro.vin, ro.plate ?? ''].join(' ').toLowerCase();
      if (!words.every((word) => text.includes(word))) return false;
    }
    return true;
  });
}

/** The advisors who wrote the listed ROs, when the server names them. */
export function advisorsOf(list: readonly RepairOrderSummary[]): { id: string; name: string }[] {
  const found = new Map<string, string>();
  for (const ro of list)
    if (ro.advisorId != null && ro.advisorName) found.set(String(ro.advisorId), ro.advisorName);
  return [...found].map(([id, name]) => ({ id, name })).sort((a, b) => a.name.localeCompare(b.name));
}

export interface LineRow {
  line: JobLineDto;
  statusText: string;
  technician: string | null;
  bay: string | null;
  /** Null when the server reports no time for the line. */
  clockedSeconds: number;
  onTheClock: string[];
  forecast: DispatchLine['forecast'];
}

const STATUS_WORDS = { queued: 'Waiting', working: 'Working', held: 'Held', done: 'Done' } as const;

export function lineStatusText(line: Pick<JobLineDto, 'status' | 'holdReason'>): string {
  return line.status === 'held' && line.holdReason
    ? `Held: ${HOLD_REASON_LABELS[line.holdReason]}`
    : STATUS_WORDS[line.status];
}

/** The RO's lines with names and times filled in from the dispatch view where the RO lacks them. */
export function lineRows(
  ro: Pick<RepairOrderSummary, 'lines'>,
  dispatch: DispatchBoard | undefined,
  findings: readonly FindingDto[] = [],
): LineRow[] {
  const technicians = new Map<number, string>();
  for (const lane of dispatch?.lanes ?? []) technicians.set(lane.technician.id, lane.technician.name);
  for (const finding of findings)
    if (!technicians.has(finding.technicianId)) technicians.set(finding.technicianId, finding.technicianName);
  const bays = new Map((dispatch?.bays ?? []).map((bay) => [bay.id, bay.name]));
  const open = new Map<number, DispatchLine>();
  for (const line of dispatch?.queue ?? []) open.set(line.id, line);
  for (const lane of dispatch?.lanes ?? []) for (const line of lane.lines) open.set(line.id, line);

  return [...ro.lines]
    .sort((a, b) => a.lineNo - b.lineNo)
    .map((line) => {
      const live = open.get(line.id);
      // The dispatch view is refreshed live; the RO's own figure was counted when it was fetched.
      const clocked = live?.clockedSeconds ?? line.clockedSeconds;
      return {
        line,
        statusText: lineStatusText(line),
        technician:
          line.technicianId === null
            ? null
            : (technicians.get(line.technicianId) ?? `Technician #${line.technicianId}`),
        bay: line.bayId === null ? null : (bays.get(line.bayId) ?? `Bay #${line.bayId}`),
        clockedSeconds: clocked,
        onTheClock: (live?.clockedOn ?? []).map((id) => technicians.get(id) ?? `#${id}`),
        forecast: live?.forecast ?? null,
      };
    });
}

export interface HistoryEntry {
  at: string;
  text: string;
}

/** What happened to the RO, from the times it and its findings carry; newest first. */
export function repairOrderHistory(
  ro: Pick<RepairOrderSummary, 'createdAt' | 'lines' | 'advisorName'>,
  findings: readonly FindingDto[],
): HistoryEntry[] {
  const entries: HistoryEntry[] = [
    { at: ro.createdAt, text: ro.advisorName ? `Written by ${ro.advisorName}` : 'Repair order written' },
  ];
  for (const line of ro.lines)
    if (line.completedAt) entries.push({ at: line.completedAt, text: `L${line.lineNo} ${line.title} done` });
  for (const finding of findings) {
    entries.push({
      at: finding.createdAt,
      text: `${finding.technicianName} reported a finding on L${finding.lineNo}`,
    });
    if (finding.approvalRequestedAt)
      entries.push({
        at: finding.approvalRequestedAt,
        text: `Approval for L${finding.lineNo}'s finding e-mailed`,
      });
    if (finding.answeredAt && finding.answer !== 'pending')
      entries.push({
        at: finding.answeredAt,
        text: `Finding on L${finding.lineNo} ${finding.answer}${finding.answeredBy ? ` by ${finding.answeredBy}` : ''}`,
      });
  }
  return entries.sort((a, b) => Date.parse(b.at) - Date.parse(a.at));
}
