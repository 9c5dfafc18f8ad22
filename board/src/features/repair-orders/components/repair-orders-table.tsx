import { useEffect, useState } from 'react';
import { Link as RouterLink, useNavigate, useSearchParams } from 'react-router';
import {
  Badge,
  Body1,
  Button,
  Caption1,
  MessageBar,
  MessageBarBody,
  SearchBox,
  Select,
  Spinner,
  Tab,
  TabList,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  ToggleButton,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { REPAIR_ORDER_STATUS_WORDS } from '@baytime/shared';
import { paths } from '@/config/paths';
import { formErrorText } from '@/lib/form-errors';
import { useUsers } from '@/lib/api/get-users';
import { useRepairOrderPage } from '../api/get-repair-orders';
import { useDebouncedValue } from '../hooks/use-debounced-value';
import {
  bookTotal,
  linesDone,
  advisorChoices,
  filtersFromParams,
  filtersToParams,
  listQuery,
  pageRange,
  type RepairOrderFilters,
  type StatusFilter,
} from '../ro-model';
import { formatBookHours, formatDateTime, formatHours } from '../ro-format';

const PAGE_SIZE = 50;
const SEARCH_SETTLE_MS = 300;

const useStyles = makeStyles({
  table: { tableLayout: 'auto' },
  tabs: { marginBottom: tokens.spacingVerticalS },
  filters: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: tokens.spacingHorizontalM,
    marginBottom: tokens.spacingVerticalM,
  },
  search: { width: '22rem', maxWidth: '100%' },
  count: { color: tokens.colorNeutralForeground3, marginLeft: 'auto' },
  pager: {
    display: 'flex',
    alignItems: 'center',
    justifyContent: 'flex-end',
    gap: tokens.spacingHorizontalM,
    marginTop: tokens.spacingVerticalM,
  },
  dim: { color: tokens.colorNeutralForeground3 },
  number: {
    fontWeight: tokens.fontWeightSemibold,
    fontVariantNumeric: 'tabular-nums',
    color: tokens.colorBrandForegroundLink,
    textDecorationLine: 'none',
    ':hover': { textDecorationLine: 'underline' },
    ':focus-visible': { outline: `2px solid ${tokens.colorStrokeFocus2}`, outlineOffset: '2px' },
  },
  row: { cursor: 'pointer' },
  promised: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalS, whiteSpace: 'nowrap' },
  numeric: { fontVariantNumeric: 'tabular-nums' },
  scroll: { overflowX: 'auto' },
});

const STATUS_COLOURS = { open: 'brand', done: 'informative', closed: 'subtle' } as const;
const STATUS_LABELS = REPAIR_ORDER_STATUS_WORDS;
const TAB_ORDER: readonly StatusFilter[] = ['open', 'done', 'closed', 'all'];
const FILTER_LABELS: Record<StatusFilter, string> = { all: 'All', ...REPAIR_ORDER_STATUS_WORDS };

interface RepairOrdersTableProps {
  /** The shop's, so promised times and "today" are the shop's. */
  timeZone: string | undefined;
  me: { id: number };
  /** Owners and foremen may read the shop's people, to filter by any advisor. */
  canListPeople: boolean;
}

/** The office's repair orders, a page at a time; the server filters and searches. */
export function RepairOrdersTable({ timeZone, me, canListPeople }: RepairOrdersTableProps) {
  const styles = useStyles();
  const navigate = useNavigate();
  const [params, setParams] = useSearchParams();
  const filters = filtersFromParams(params);
  const [searchText, setSearchText] = useState(filters.search);
  const search = useDebouncedValue(searchText, SEARCH_SETTLE_MS);
  const set = (change: Partial<RepairOrderFilters>) =>
    setParams(filtersToParams({ ...filters, ...change }), { replace: true });
  useEffect(() => {
    if (search.trim() !== filters.search)
      setParams(filtersToParams({ ...filters, search }), { replace: true });
    // Only a settled search text moves into the address.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [search]);

  // A cursor per page seen, so Previous goes back without the server counting offsets; any other
  // filter starts again at the first page.
  const filterKey = listQuery(filters, { limit: PAGE_SIZE });
  const [paging, setPaging] = useState<{ key: string; cursors: (string | undefined)[] }>({
    key: filterKey,
    cursors: [undefined],
  });
  const cursors = paging.key === filterKey ? paging.cursors : [undefined];
  const pageIndex = cursors.length - 1;
  const orders = useRepairOrderPage(listQuery(filters, { limit: PAGE_SIZE, cursor: cursors[pageIndex] }));
  const lateCount = useRepairOrderPage(listQuery({ ...filters, late: true }, { limit: 1 })).data?.total;
  const people = useUsers(canListPeople);
  const advisors = advisorChoices(canListPeople ? people.data : undefined, me);

  const shown = orders.data?.items ?? [];
  const total = orders.data?.total ?? 0;
  const nextCursor = orders.data?.nextCursor ?? null;
  const filtered = filtersToParams(filters).size > 0;

  return (
    <>
      <TabList
        className={styles.tabs}
        selectedValue={filters.status}
        onTabSelect={(_, data) => set({ status: data.value as StatusFilter })}
        aria-label="Repair order status"
      >
        {TAB_ORDER.map((value) => (
          <Tab key={value} value={value}>
            {FILTER_LABELS[value]}
          </Tab>
        ))}
      </TabList>
      <div className={styles.filters} role="group" aria-label="Filters">
        <SearchBox
          className={styles.search}
          placeholder="RO, customer, phone, plate or VIN"
          aria-label="Search repair orders"
          value={searchText}
          onChange={(_, data) => setSearchText(data.value)}
        />
        {advisors.length > 0 && (
          <Select
            aria-label="Advisor"
            value={filters.advisor}
            onChange={(_, data) => set({ advisor: data.value })}
          >
            <option value="">Every advisor</option>
            {advisors.map((advisor) => (
              <option key={advisor.id} value={advisor.id}>
                {advisor.name}
              </option>
            ))}
          </Select>
        )}
        <ToggleButton
          appearance={filters.promisedToday ? 'primary' : 'secondary'}
          checked={filters.promisedToday}
          onClick={() => set({ promisedToday: !filters.promisedToday })}
        >
          Promised today
        </ToggleButton>
        <ToggleButton
          appearance={filters.late ? 'primary' : 'secondary'}
          checked={filters.late}
          onClick={() => set({ late: !filters.late })}
        >
          Late{lateCount ? ` (${lateCount})` : ''}
        </ToggleButton>
        {orders.isSuccess && (
          <Caption1 className={styles.count} role="status">
            {/* The rows on screen may still be the last page's while this one loads. */}
            {orders.isPlaceholderData ? 'Loading…' : pageRange(pageIndex, PAGE_SIZE, shown.length, total)}
          </Caption1>
        )}
      </div>
      {orders.isPending ? (
        <Spinner label="Loading repair orders…" />
      ) : orders.isError ? (
        <MessageBar intent="error">
          <MessageBarBody>{formErrorText(orders.error)}</MessageBarBody>
        </MessageBar>
      ) : shown.length === 0 ? (
        <Body1 className={styles.dim}>
          {filtered ? 'No repair order matches these filters.' : 'No repair orders here.'}
        </Body1>
      ) : (
        <div className={styles.scroll}>
          <Table aria-label="Repair orders" className={styles.table}>
            <TableHeader>
              <TableRow>
                <TableHeaderCell>RO</TableHeaderCell>
                <TableHeaderCell>Customer</TableHeaderCell>
                <TableHeaderCell>Vehicle</TableHeaderCell>
                <TableHeaderCell>Status</TableHeaderCell>
                <TableHeaderCell>Promised</TableHeaderCell>
                <TableHeaderCell>Job lines</TableHeaderCell>
                <TableHeaderCell>Book</TableHeaderCell>
                <TableHeaderCell>Clocked</TableHeaderCell>
              </TableRow>
            </TableHeader>
            <TableBody>
              {shown.map((order) => {
                const { done, of } = linesDone(order.lines);
                const held = order.lines.filter((line) => line.status === 'held').length;
                const book = bookTotal(order.lines);
                const clocked = order.lines.reduce((sum, line) => sum + line.clockedSeconds, 0);
                // Late by the one definition dispatch and the wall count, worked out by the server.
                const late = order.late;
                return (
                  <TableRow
                    key={order.id}
                    className={styles.row}
                    onClick={(event) => {
                      if ((event.target as HTMLElement).closest('a')) return;
                      void navigate(paths.repairOrder(order.id));
                    }}
                  >
                    <TableCell>
                      <RouterLink to={paths.repairOrder(order.id)} className={styles.number}>
                        {order.number}
                      </RouterLink>
                    </TableCell>
                    <TableCell>{order.customerName}</TableCell>
                    <TableCell>{order.vehicle}</TableCell>
                    <TableCell>
                      <Badge appearance="tint" color={STATUS_COLOURS[order.status]}>
                        {STATUS_LABELS[order.status]}
                      </Badge>
                    </TableCell>
                    <TableCell>
                      <span className={styles.promised}>
                        {order.promisedAt ? formatDateTime(order.promisedAt, timeZone) : '—'}
                        {late && (
                          <Badge appearance="filled" color="danger">
                            LATE
                          </Badge>
                        )}
                      </span>
                    </TableCell>
                    <TableCell>
                      {done} of {of} done
                      {held > 0 && <Caption1 className={styles.dim}> · {held} held</Caption1>}
                    </TableCell>
                    <TableCell className={styles.numeric}>{formatBookHours(book)}</TableCell>
                    <TableCell className={styles.numeric}>{formatHours(clocked)}</TableCell>
                  </TableRow>
                );
              })}
            </TableBody>
          </Table>
          <nav className={styles.pager} aria-label="Pages">
            <Button
              disabled={pageIndex === 0}
              onClick={() => setPaging({ key: filterKey, cursors: cursors.slice(0, -1) })}
            >
              Previous
            </Button>
            <Button
              disabled={!nextCursor || orders.isPlaceholderData}
              onClick={() => nextCursor && setPaging({ key: filterKey, cursors: [...cursors, nextCursor] })}
            >
              Next
            </Button>
          </nav>
        </div>
      )}
    </>
  );
}
