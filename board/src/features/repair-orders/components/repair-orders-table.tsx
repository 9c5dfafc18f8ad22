import { useMemo } from 'react';
import { Link as RouterLink, useNavigate, useSearchParams } from 'react-router';
import {
  Badge,
  Body1,
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
import { paths } from '@/config/paths';
import { formErrorText } from '@/lib/form-errors';
import { useRepairOrders } from '../api/get-repair-orders';
import { useDispatch } from '../api/get-dispatch';
import { useMinuteNow } from '@/hooks/use-minute-now';
import {
  advisorsOf,
  filterRepairOrders,
  filtersFromParams,
  filtersToParams,
  isLate,
  lateLineIds,
  statusForServer,
  type RepairOrderFilters,
  type StatusFilter,
} from '../ro-model';
import { formatBookHours, formatDateTime } from '../ro-format';

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

const STATUS_COLOURS = { open: 'brand', done: 'success', closed: 'subtle' } as const;
const STATUS_LABELS = { open: 'Open', done: 'Work done', closed: 'Closed' } as const;
const TAB_ORDER: readonly StatusFilter[] = ['open', 'done', 'closed', 'all'];
const FILTER_LABELS: Record<StatusFilter, string> = {
  all: 'All',
  open: 'Open',
  done: 'Work done',
  closed: 'Closed',
};

/** `timeZone`: the shop's, so promised times and "today" are the shop's. */
export function RepairOrdersTable({ timeZone }: { timeZone: string | undefined }) {
  const styles = useStyles();
  const navigate = useNavigate();
  const [params, setParams] = useSearchParams();
  const filters = filtersFromParams(params);
  const orders = useRepairOrders(statusForServer(filters.status));
  const dispatch = useDispatch();
  const nowMs = useMinuteNow();
  const zone = timeZone ?? Intl.DateTimeFormat().resolvedOptions().timeZone;
  const lateLines = useMemo(() => lateLineIds(dispatch.data), [dispatch.data]);

  const set = (change: Partial<RepairOrderFilters>) =>
    setParams(filtersToParams({ ...filters, ...change }), { replace: true });

  const all = orders.data ?? [];
  const advisors = advisorsOf(all);
  const shown = filterRepairOrders(all, filters, { nowMs, timeZone: zone, lateLines });
  const lateCount = all.filter((ro) => isLate(ro, nowMs, lateLines)).length;

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
          placeholder="RO, customer, vehicle or VIN"
          aria-label="Search repair orders"
          value={filters.search}
          onChange={(_, data) => set({ search: data.value })}
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
          Late{lateCount > 0 ? ` (${lateCount})` : ''}
        </ToggleButton>
        {orders.isSuccess && (
          <Caption1 className={styles.count} role="status">
            {shown.length} of {all.length} shown
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
          {all.length === 0 ? 'No repair orders here.' : 'No repair order matches these filters.'}
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
              </TableRow>
            </TableHeader>
            <TableBody>
              {shown.map((order) => {
                const done = order.lines.filter((line) => line.status === 'done').length;
                const held = order.lines.filter((line) => line.status === 'held').length;
                const book = order.lines.reduce((sum, line) => sum + line.bookHours, 0);
                const late = isLate(order, nowMs, lateLines);
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
                      {done} of {order.lines.length} done
                      {held > 0 && <Caption1 className={styles.dim}> · {held} held</Caption1>}
                    </TableCell>
                    <TableCell className={styles.numeric}>{formatBookHours(book)}</TableCell>
                  </TableRow>
                );
              })}
            </TableBody>
          </Table>
        </div>
      )}
    </>
  );
}
