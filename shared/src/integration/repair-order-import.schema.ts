import { z } from 'zod';

/**
 * The columns of an RO import file, one row per job line. Rows with the same `ro_ref` make one RO;
 * its customer, vehicle and concern come from its first row (later rows may leave them empty).
 */
export const RO_IMPORT_COLUMNS = [
  'ro_ref',
  'customer_name',
  'customer_phone',
  'customer_email',
  'vin',
  'year',
  'make',
  'model',
  'plate',
  'odometer',
  'concern',
  'promised_at',
  'line_title',
  'book_hours',
] as const;
export type RoImportColumn = (typeof RO_IMPORT_COLUMNS)[number];

/** Columns every RO needs on its first row; `line_title` and `book_hours` on every row. */
export const RO_IMPORT_REQUIRED: readonly RoImportColumn[] = [
  'ro_ref',
  'customer_name',
  'vin',
  'year',
  'make',
  'model',
  'odometer',
  'concern',
  'line_title',
  'book_hours',
];

/** A file of about 500 lines; a larger export is split. */
export const RO_IMPORT_MAX_CHARACTERS = 90_000;

export const repairOrderImportSchema = z
  .object({
    csv: z
      .string()
      .min(1, 'The file is empty')
      .max(RO_IMPORT_MAX_CHARACTERS, `At most ${RO_IMPORT_MAX_CHARACTERS} characters: split the file`),
  })
  .strict();
export type RepairOrderImportBody = z.infer<typeof repairOrderImportSchema>;

/** A problem in the file: row 1 is the header, as a spreadsheet numbers them. */
export interface ImportCellError {
  row: number;
  /** The column's header name; null when the whole row or file is at fault. */
  column: RoImportColumn | null;
  message: string;
}

export interface ImportedRepairOrder {
  externalRef: string;
  rows: number[];
  customerName: string;
  vehicle: string;
  lines: number;
  bookHours: number;
  /** `new`: saved (or to be saved); `known`: an RO with this reference is already in Baytime; `refused`: see `errors`. */
  outcome: 'new' | 'known' | 'refused';
  repairOrderId: number | null;
  number: string | null;
  errors: ImportCellError[];
}

/** The preview (nothing saved) or the result of an import: ROs with an error are never saved. */
export interface RepairOrderImportResult {
  saved: boolean;
  repairOrders: ImportedRepairOrder[];
  /** Errors not tied to one RO: a missing column, a broken quote. */
  fileErrors: ImportCellError[];
}

/** The template the office offers: the header and one RO of two lines, with invented details. */
export function repairOrderImportTemplate(): string {
  const rows = [
    RO_IMPORT_COLUMNS.join(','),
    'EXT-1001,Mira Castellan,608-555-0190,mira@example.test,1M8GDM9AXKP042788,2019,Halvard,Morrow,KLD 204,61200,' +
      '"Squeal from the front when braking",,Front brake pads and rotors,2.1',
    'EXT-1001,,,,,,,,,,,,Brake fluid exchange,0.8',
  ];
  return `${rows.join('\r\n')}\r\n`;
}
