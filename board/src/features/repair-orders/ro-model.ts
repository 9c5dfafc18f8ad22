import {
  JOB_LINE_STATUS_WORDS,
  lineStatusWords,
  type DispatchBoard,
  type DispatchLine,
  type FindingDto,
  type JobLineDto,
  type RepairOrderStatus,
  type UserDto,
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

/** The list's query for the server: the filters as the page holds them, and which page. */
export function listQuery(
  filters: RepairOrderFilters,
  page: { limit: number; cursor?: string | undefined },
): string {
  const query = new URLSearchParams({ limit: String(page.limit) });
  const status = statusForServer(filters.status);
  if (status) query.set('status', status);
  const q = filters.search.trim();
  if (q) query.set('q', q);
  if (filters.advisor) query.set('advisorId', filters.advisor);
  if (filters.promisedToday) query.set('promised', 'today');
  if (filters.late) query.set('late', 'true');
  if (page.cursor) query.set('cursor', page.cursor);
  return query.toString();
}

/** "51–100 of 240" for the second page of 50; "No repair orders" when there are none. */
export function pageRange(pageIndex: number, limit: number, shown: number, total: number): string {
  if (total === 0 || shown === 0) return 'No repair orders';
  const first = pageIndex * limit + 1;
  return `${first.toLocaleString('en-US')}–${(first + shown - 1).toLocaleString('en-US')} of ${total.toLocaleString('en-US')}`;
}

/** People who write repair orders, by name, for the advisor filter. */
export function advisorChoices(
  users: readonly Pick<UserDto, 'id' | 'name' | 'role' | 'active'>[] | undefined,
  me: { id: number },
): { id: string; name: string }[] {
  if (!users) return [{ id: String(me.id), name: 'Mine' }];
  return users
    .filter(
      (user) => user.active && (user.role === 'advisor' || user.role === 'foreman' || user.role === 'owner'),
    )
    .map((user) => ({ id: String(user.id), name: user.name }))
    .sort((a, b) => a.name.localeCompare(b.name));
}

export interface LineRow {
  line: RepairOrderSummary['lines'][number];
  statusText: string;
  technician: string | null;
  bay: string | null;
  /** Null when the server reports no time for the line. */
  clockedSeconds: number;
  onTheClock: string[];
  forecast: DispatchLine['forecast'];
}

export function lineStatusText(line: Pick<JobLineDto, 'status' | 'holdReason'>): string {
  return lineStatusWords(line);
}

/** The three Cs and a cancellation under a line, each with its label; a blank one is left out. */
export function lineNotes(
  line: Pick<JobLineDto, 'concern' | 'cause' | 'correction' | 'cancelReason'>,
): { label: string; text: string }[] {
  return [
    { label: 'Concern', text: line.concern },
    { label: 'Cause', text: line.cause },
    { label: 'Correction', text: line.correction },
    { label: JOB_LINE_STATUS_WORDS.cancelled, text: line.cancelReason },
  ].filter((note): note is { label: string; text: string } => !!note.text?.trim());
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

type Plain = Record<string, unknown>;
const isPlain = (value: unknown): value is Plain =>
  typeof value === 'object' && value !== null && !Array.isArray(value);
const same = (a: unknown, b: unknown) => a === b || JSON.stringify(a) === JSON.stringify(b);

/**
 * What an edit dialog sends: only what differs from what it opened with, nested groups included.
 * Sending the whole form would put back whatever someone else saved since the dialog was opened.
 */
export function changedFields<T extends Plain>(opened: Plain, edited: T): Partial<T> {
  const changes: Plain = {};
  for (const [key, value] of Object.entries(edited)) {
    if (value === undefined) continue;
    const before = opened[key];
    if (isPlain(value) && isPlain(before)) {
      const inner = changedFields(before, value);
      if (Object.keys(inner).length > 0) changes[key] = inner;
    } else if (!same(value, before)) changes[key] = value;
  }
  return changes as Partial<T>;
}

/**
 * What the dialog opened with for each field it changed (`changed`, from `changedFields`), nested groups
 * included: sent as `was`, so the server refuses the edit if someone changed one of those fields since.
 */
export function readFields(opened: Plain, changed: Plain): Plain {
  return Object.fromEntries(
    Object.entries(changed).map(([key, value]) => {
      const before = opened[key];
      return [key, isPlain(value) && isPlain(before) ? readFields(before, value) : (before ?? null)];
    }),
  );
}

/** A field both the advisor and someone else changed: theirs is in the form now, the advisor's words here. */
export interface ReplacedEdit {
  path: string;
  yours: unknown;
}

/**
 * The form after reloading an edit refused as stale: what someone else saved, with the advisor's own
 * changes put back wherever the other person left that field as the dialog first read it. Where both
 * changed a field, theirs wins (it is what the server now holds) and the advisor's value comes back in
 * `replaced`, so nothing typed is lost unseen.
 */
export function keepEditsOnReload<T extends Plain>(
  opened: Plain,
  edited: Plain,
  fresh: T,
  prefix = '',
): { values: T; kept: string[]; replaced: ReplacedEdit[] } {
  const values: Plain = {};
  const kept: string[] = [];
  const replaced: ReplacedEdit[] = [];
  for (const [key, theirs] of Object.entries(fresh)) {
    const path = prefix + key;
    const before = opened[key];
    const yours = edited[key];
    if (isPlain(theirs) && isPlain(before) && isPlain(yours)) {
      const inner = keepEditsOnReload(before, yours, theirs, `${path}.`);
      values[key] = inner.values;
      kept.push(...inner.kept);
      replaced.push(...inner.replaced);
    } else if (yours === undefined || same(yours, before) || same(yours, theirs)) values[key] = theirs;
    else if (same(theirs, before)) {
      values[key] = yours;
      kept.push(path);
    } else {
      values[key] = theirs;
      replaced.push({ path, yours });
    }
  }
  return { values: values as T, kept, replaced };
}

type CountedLine = Pick<JobLineDto, 'status' | 'bookHours'>;

/** A cancelled line stays on the RO for its record but is never flagged, so it is no part of the book. */
export const bookTotal = (lines: readonly CountedLine[]) =>
  lines.reduce((sum, line) => (line.status === 'cancelled' ? sum : sum + line.bookHours), 0);

/** "1 of 2 lines done", a cancelled line counting in neither. */
export function linesDone(lines: readonly CountedLine[]): { done: number; of: number } {
  const counted = lines.filter((line) => line.status !== 'cancelled');
  return { done: counted.filter((line) => line.status === 'done').length, of: counted.length };
}
