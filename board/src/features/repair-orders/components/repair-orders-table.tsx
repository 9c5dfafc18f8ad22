import { useMemo, useState } from 'react';
import {
  Badge,
  Body1,
  Caption1,
  MessageBar,
  MessageBarBody,
  Spinner,
  Tab,
  TabList,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import type { RepairOrderStatus } from '@baytime/shared';
import { formErrorText } from '@/lib/form-errors';
import { useRepairOrders, type RepairOrderVehicle } from '../api/get-repair-orders';

const useStyles = makeStyles({
  table: { tableLayout: 'auto' },
  tabs: { marginBottom: tokens.spacingVerticalM },
  dim: { color: tokens.colorNeutralForeground3 },
  number: { fontWeight: tokens.fontWeightSemibold, fontVariantNumeric: 'tabular-nums' },
  scroll: { overflowX: 'auto' },
});

const STATUS_COLOURS = { open: 'brand', done: 'success', closed: 'subtle' } as const;
const FILTERS = ['all', 'open', 'done', 'closed'] as const;
type Filter = (typeof FILTERS)[number];
const FILTER_LABELS: Record<Filter, string> = { all: 'All', open: 'Open', done: 'Done', closed: 'Closed' };

function promisedFormat(timeZone: string | undefined): Intl.DateTimeFormat {
  const options: Intl.DateTimeFormatOptions = {
    weekday: 'short',
    month: 'short',
    day: 'numeric',
    hour: 'numeric',
    minute: '2-digit',
  };
  try {
    return new Intl.DateTimeFormat(undefined, { ...options, timeZone });
  } catch {
    return new Intl.DateTimeFormat(undefined, options);
  }
}

export function vehicleText(vehicle: RepairOrderVehicle): string {
  if (!vehicle) return '—';
  if (typeof vehicle === 'string') return vehicle;
  return [vehicle.year, vehicle.make, vehicle.model].filter(Boolean).join(' ') || vehicle.vin || '—';
}

/** `timeZone`: the shop's, so promised times read as the shop keeps them. */
export function RepairOrdersTable({ timeZone }: { timeZone?: string }) {
  const styles = useStyles();
  const dateTime = useMemo(() => promisedFormat(timeZone), [timeZone]);
  const [filter, setFilter] = useState<Filter>('open');
  const orders = useRepairOrders(filter === 'all' ? undefined : (filter as RepairOrderStatus));

  return (
    <>
      <TabList
        className={styles.tabs}
        selectedValue={filter}
        onTabSelect={(_, data) => setFilter(data.value as Filter)}
        aria-label="Show repair orders"
      >
        {FILTERS.map((value) => (
          <Tab key={value} value={value}>
            {FILTER_LABELS[value]}
          </Tab>
        ))}
      </TabList>
      {orders.isPending ? (
        <Spinner label="Loading repair orders…" />
      ) : orders.isError ? (
        <MessageBar intent="error">
          <MessageBarBody>{formErrorText(orders.error)}</MessageBarBody>
        </MessageBar>
      ) : orders.data.length === 0 ? (
        <Body1 className={styles.dim}>No repair orders here.</Body1>
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
                <TableHeaderCell>Book hours</TableHeaderCell>
              </TableRow>
            </TableHeader>
            <TableBody>
              {orders.data.map((order) => {
                const done = order.lines.filter((line) => line.status === 'done').length;
                const held = order.lines.filter((line) => line.status === 'held').length;
                const book = order.lines.reduce((sum, line) => sum + line.bookHours, 0);
                return (
                  <TableRow key={order.id}>
                    <TableCell className={styles.number}>{order.number}</TableCell>
                    <TableCell>{order.customerName}</TableCell>
                    <TableCell>{vehicleText(order.vehicle)}</TableCell>
                    <TableCell>
                      <Badge appearance="tint" color={STATUS_COLOURS[order.status]}>
                        {order.status}
                      </Badge>
                    </TableCell>
                    <TableCell>
                      {order.promisedAt ? dateTime.format(new Date(order.promisedAt)) : '—'}
                    </TableCell>
                    <TableCell>
                      {done} of {order.lines.length} done
                      {held > 0 && <Caption1 className={styles.dim}> · {held} held</Caption1>}
                    </TableCell>
                    <TableCell>{book.toFixed(1)}</TableCell>
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
