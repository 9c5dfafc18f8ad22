import { CsvError, parse } from 'csv-parse/sync';
import {
  createRepairOrderSchema,
  parseDecimal,
  RO_IMPORT_COLUMNS,
  RO_IMPORT_REQUIRED,
  type CreateRepairOrderBody,
  type ImportCellError,
  type RoImportColumn,
} from '@baytime/shared';

/** One RO as the file gives it: its rows, the body they make, and what is wrong with them. */
export interface ImportGroup {
  externalRef: string;
  rows: number[];
  body: CreateRepairOrderBody | null;
  /** For the preview's summary, even when the body is refused. */
  customerName: string;
  vehicle: string;
  bookHours: number;
  errors: ImportCellError[];
}

export interface ImportFile {
  groups: ImportGroup[];
  fileErrors: ImportCellError[];
}

type Cells = Record<RoImportColumn, string>;
/** A record as csv-parse gives it with `info: true`: its cells and the line it ends on. */
type ParsedRecord = { record: string[]; info: { lines: number } };
interface Row {
  row: number;
  cells: Cells;
}

const RO_COLUMNS = RO_IMPORT_COLUMNS.filter((column) => column !== 'line_title' && column !== 'book_hours');

/** Where a field of the RO body comes from in the file. */
const COLUMN_OF_PATH: Record<string, RoImportColumn> = {
  externalRef: 'ro_ref',
  'customer.name': 'customer_name',
  'customer.phone': 'customer_phone',
  'customer.email': 'customer_email',
  'vehicle.vin': 'vin',
  'vehicle.year': 'year',
  'vehicle.make': 'make',
  'vehicle.model': 'model',
  'vehicle.plate': 'plate',
  'vehicle.odometer': 'odometer',
  concern: 'concern',
  promisedAt: 'promised_at',
  lines: 'line_title',
  title: 'line_title',
  bookHours: 'book_hours',
};

/** The row and column an issue of the body points at: a line's own row, or the RO's first row. */
export function cellOf(path: readonly PropertyKey[], rows: number[], message: string): ImportCellError {
  if (path[0] === 'lines' && typeof path[1] === 'number' && path[2] !== undefined)
    return { row: rows[path[1]] ?? rows[0]!, column: COLUMN_OF_PATH[String(path[2])] ?? null, message };
  return { row: rows[0]!, column: COLUMN_OF_PATH[path.slice(0, 2).join('.')] ?? null, message };
}

/**
 * Reads an RO import file with csv-parse: a header row naming the columns, then one row per job line.
 * Every problem is reported at its row and column; nothing is decided about saving here.
 */
export function readImportFile(csv: string): ImportFile {
  let records: ParsedRecord[];
  try {
    records = parse(csv, {
      bom: true,
      trim: true,
      skip_empty_lines: true,
      relax_column_count: true,
      info: true,
    }) as unknown as ParsedRecord[];
  } catch (error) {
    if (!(error instanceof CsvError)) throw error;
    const row = typeof error.lines === 'number' ? error.lines : 1;
    return {
      groups: [],
      fileErrors: [{ row, column: null, message: `The file is not valid CSV: ${error.message}` }],
    };
  }
  const [header, ...data] = records;
  if (!header)
    return { groups: [], fileErrors: [{ row: 1, column: null, message: 'The file has no header row' }] };
  const names = header.record.map((name) => name.toLowerCase());
  const fileErrors: ImportCellError[] = [
    ...names
      .filter((name) => !(RO_IMPORT_COLUMNS as readonly string[]).includes(name))
      .map((name) => ({ row: header.info.lines, column: null, message: `Unknown column "${name}"` })),
    ...RO_IMPORT_REQUIRED.filter((column) => !names.includes(column)).map((column) => ({
      row: header.info.lines,
      column,
      message: 'This column is missing',
    })),
  ];
  if (fileErrors.length) return { groups: [], fileErrors };
  if (!data.length)
    return { groups: [], fileErrors: [{ row: 2, column: null, message: 'The file has no rows' }] };

  const byRef = new Map<string, Row[]>();
  for (const { record, info } of data) {
    const cells = Object.fromEntries(
      RO_IMPORT_COLUMNS.map((column) => [column, record[names.indexOf(column)] ?? '']),
    ) as Cells;
    if (record.length > names.length)
      fileErrors.push({ row: info.lines, column: null, message: 'More cells than the header has columns' });
    else if (!cells.ro_ref)
      fileErrors.push({ row: info.lines, column: 'ro_ref', message: 'Every row needs the RO reference' });
    else byRef.set(cells.ro_ref, [...(byRef.get(cells.ro_ref) ?? []), { row: info.lines, cells }]);
  }
  return { groups: [...byRef].map(([ref, rows]) => readGroup(ref, rows)), fileErrors };
}

function readGroup(externalRef: string, rows: Row[]): ImportGroup {
  const [first] = rows as [Row, ...Row[]];
  const errors: ImportCellError[] = [];
  for (const { row, cells } of rows)
    for (const column of RO_COLUMNS)
      if (cells[column] && row !== first.row && cells[column] !== first.cells[column])
        errors.push({ row, column, message: `Differs from row ${first.row}: leave it empty or repeat it` });
  for (const { row, cells } of rows)
    for (const column of RO_IMPORT_REQUIRED)
      if (!cells[column] && (row === first.row || column === 'line_title' || column === 'book_hours'))
        errors.push({ row, column, message: 'This cell is empty' });
  const number = (row: number, column: RoImportColumn, text: string): number => {
    const value = parseDecimal(text);
    if (text && value === null) errors.push({ row, column, message: 'Write a plain number, like 2.5' });
    return value ?? Number.NaN;
  };
  const ro = first.cells;
  const optional = (text: string) => text || undefined;
  const candidate = {
    externalRef,
    customer: {
      name: ro.customer_name,
      phone: optional(ro.customer_phone),
      email: optional(ro.customer_email),
    },
    vehicle: {
      vin: ro.vin,
      year: number(first.row, 'year', ro.year),
      make: ro.make,
      model: ro.model,
      plate: optional(ro.plate),
      odometer: number(first.row, 'odometer', ro.odometer),
    },
    concern: ro.concern,
    promisedAt: optional(ro.promised_at),
    lines: rows.map(({ row, cells }) => ({
      title: cells.line_title,
      bookHours: number(row, 'book_hours', cells.book_hours),
    })),
  };
  const summary = {
    externalRef,
    rows: rows.map(({ row }) => row),
    customerName: ro.customer_name,
    vehicle: [ro.year, ro.make, ro.model].filter(Boolean).join(' '),
    bookHours: candidate.lines.reduce(
      (sum, line) => sum + (Number.isFinite(line.bookHours) ? line.bookHours : 0),
      0,
    ),
  };
  if (errors.length) return { ...summary, body: null, errors: dedupe(errors) };
  const parsed = createRepairOrderSchema.safeParse(candidate);
  if (parsed.success) return { ...summary, body: parsed.data, errors: [] };
  return {
    ...summary,
    body: null,
    errors: dedupe(parsed.error.issues.map((issue) => cellOf(issue.path, summary.rows, issue.message))),
  };
}

/** One error per cell, in row order: an empty cell is not also "not a number". */
function dedupe(errors: ImportCellError[]): ImportCellError[] {
  const seen = new Set<string>();
  return errors
    .filter((error) => {
      const key = `${error.row}:${error.column}`;
      if (seen.has(key)) return false;
      seen.add(key);
      return true;
    })
    .sort((a, b) => a.row - b.row);
}
