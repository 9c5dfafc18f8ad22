import { useState, type ChangeEvent } from 'react';
import { Link as RouterLink } from 'react-router';
import {
  Badge,
  Body1,
  Button,
  Caption1,
  Card,
  Label,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import {
  repairOrderImportTemplate,
  RO_IMPORT_MAX_CHARACTERS,
  type ImportCellError,
  type ImportedRepairOrder,
  type RepairOrderImportResult,
} from '@baytime/shared';
import { paths } from '@/config/paths';
import { formErrorText } from '@/lib/form-errors';
import { useImportRepairOrders } from '../api/import-repair-orders';
import { usePreviewRepairOrderImport } from '../api/preview-repair-order-import';

const OUTCOME: Record<
  ImportedRepairOrder['outcome'],
  { word: string; color: 'brand' | 'informative' | 'danger' }
> = {
  new: { word: 'New', color: 'brand' },
  known: { word: 'Already in Baytime', color: 'informative' },
  refused: { word: 'Has errors', color: 'danger' },
};

const useStyles = makeStyles({
  card: {
    padding: tokens.spacingHorizontalXL,
    gap: tokens.spacingVerticalM,
    marginBottom: tokens.spacingVerticalXL,
  },
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalL, alignItems: 'flex-end' },
  file: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXS },
  errors: { margin: 0, paddingLeft: '1.1rem', color: tokens.colorPaletteRedForeground1 },
  dim: { color: tokens.colorNeutralForeground3 },
  table: { tableLayout: 'auto', marginBottom: tokens.spacingVerticalL },
});

const cellText = (error: ImportCellError) =>
  `Row ${error.row}${error.column ? `, column ${error.column}` : ''}: ${error.message}`;

function downloadTemplate() {
  const url = URL.createObjectURL(
    new Blob([repairOrderImportTemplate()], { type: 'text/csv;charset=utf-8' }),
  );
  const link = Object.assign(document.createElement('a'), {
    href: url,
    download: 'baytime-ro-import-template.csv',
  });
  link.click();
  URL.revokeObjectURL(url);
}

function ResultTable({ result }: { result: RepairOrderImportResult }) {
  const styles = useStyles();
  return (
    <Table
      aria-label={result.saved ? 'Imported repair orders' : 'Repair orders in the file'}
      className={styles.table}
    >
      <TableHeader>
        <TableRow>
          <TableHeaderCell>Reference</TableHeaderCell>
          <TableHeaderCell>Customer and vehicle</TableHeaderCell>
          <TableHeaderCell>Lines</TableHeaderCell>
          <TableHeaderCell>Outcome</TableHeaderCell>
        </TableRow>
      </TableHeader>
      <TableBody>
        {result.repairOrders.map((ro) => (
          <TableRow key={ro.externalRef}>
            <TableCell>
              {ro.externalRef}
              <br />
              <Caption1 className={styles.dim}>
                {ro.rows.length === 1 ? `row ${ro.rows[0]}` : `rows ${ro.rows[0]}–${ro.rows.at(-1)}`}
              </Caption1>
            </TableCell>
            <TableCell>
              {ro.customerName || '—'}
              <br />
              <Caption1 className={styles.dim}>{ro.vehicle || '—'}</Caption1>
            </TableCell>
            <TableCell>
              {ro.lines} ({ro.bookHours.toFixed(1)} h)
            </TableCell>
            <TableCell>
              <Badge appearance="tint" color={OUTCOME[ro.outcome].color}>
                {OUTCOME[ro.outcome].word}
              </Badge>{' '}
              {ro.repairOrderId && ro.number && (
                <RouterLink to={paths.repairOrder(ro.repairOrderId)}>RO {ro.number}</RouterLink>
              )}
              {ro.errors.length > 0 && (
                <ul className={styles.errors}>
                  {ro.errors.map((error) => (
                    <li key={`${error.row}-${error.column}`}>{cellText(error)}</li>
                  ))}
                </ul>
              )}
            </TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}

/**
 * Import ROs from another system's export: one CSV row per job line. The file is checked first and
 * every error shown at its row and column; nothing is saved until the import button, and an RO with
 * any error is never saved.
 */
export function RepairOrderImport() {
  const styles = useStyles();
  const preview = usePreviewRepairOrderImport();
  const run = useImportRepairOrders();
  const [file, setFile] = useState<{ name: string; csv: string } | null>(null);
  const [tooLarge, setTooLarge] = useState(false);

  const choose = async (event: ChangeEvent<HTMLInputElement>) => {
    const chosen = event.target.files?.[0];
    run.reset();
    preview.reset();
    setFile(null);
    if (!chosen) return;
    const csv = await chosen.text();
    setTooLarge(csv.length > RO_IMPORT_MAX_CHARACTERS);
    if (csv.length > RO_IMPORT_MAX_CHARACTERS) return;
    setFile({ name: chosen.name, csv });
    preview.mutate({ csv });
  };

  const checked = preview.data;
  const fresh = checked?.repairOrders.filter((ro) => ro.outcome === 'new').length ?? 0;
  const refused = checked?.repairOrders.filter((ro) => ro.outcome === 'refused').length ?? 0;
  const done = run.data;

  return (
    <>
      <Card className={styles.card}>
        <Subtitle2 as="h2">1. Choose the file</Subtitle2>
        <Body1>
          One row per job line; rows with the same <code>ro_ref</code> make one repair order. Start from the
          template to get the columns right.
        </Body1>
        <div className={styles.row}>
          <div className={styles.file}>
            <Label htmlFor="ro-import-file">CSV file</Label>
            <input
              id="ro-import-file"
              type="file"
              accept=".csv,text/csv"
              onChange={(event) => void choose(event)}
            />
          </div>
          <Button onClick={downloadTemplate}>Download the template</Button>
        </div>
        {tooLarge && (
          <MessageBar intent="error">
            <MessageBarBody>
              The file is larger than {RO_IMPORT_MAX_CHARACTERS.toLocaleString()} characters: split it.
            </MessageBarBody>
          </MessageBar>
        )}
        {preview.isError && (
          <MessageBar intent="error">
            <MessageBarBody>{formErrorText(preview.error)}</MessageBarBody>
          </MessageBar>
        )}
      </Card>

      {checked && file && !done && (
        <Card className={styles.card}>
          <Subtitle2 as="h2">2. Check what it holds</Subtitle2>
          <Body1 className={styles.dim}>Nothing is saved yet. {file.name}</Body1>
          {checked.fileErrors.length > 0 && (
            <MessageBar intent="error" layout="multiline">
              <MessageBarBody>
                <MessageBarTitle>The file cannot be read as it is.</MessageBarTitle>
                <ul className={styles.errors}>
                  {checked.fileErrors.map((error) => (
                    <li key={`${error.row}-${error.column}-${error.message}`}>{cellText(error)}</li>
                  ))}
                </ul>
              </MessageBarBody>
            </MessageBar>
          )}
          {checked.repairOrders.length > 0 && <ResultTable result={checked} />}
          {refused > 0 && (
            <Body1>
              {refused === 1 ? 'One repair order has' : `${refused} repair orders have`} errors: fix the file
              and choose it again, or import the others now and leave {refused === 1 ? 'it' : 'them'} out.
            </Body1>
          )}
          <div className={styles.row}>
            <Button
              appearance="primary"
              disabled={fresh === 0 || run.isPending}
              onClick={() => run.mutate({ csv: file.csv })}
            >
              {run.isPending ? 'Importing…' : `Import ${fresh} repair order${fresh === 1 ? '' : 's'}`}
            </Button>
          </div>
          {run.isError && (
            <MessageBar intent="error">
              <MessageBarBody>{formErrorText(run.error)}</MessageBarBody>
            </MessageBar>
          )}
        </Card>
      )}

      {done && (
        <Card className={styles.card}>
          <Subtitle2 as="h2">Imported</Subtitle2>
          <MessageBar intent="success">
            <MessageBarBody>
              {done.repairOrders.filter((ro) => ro.outcome === 'new').length} repair orders saved; their lines
              are in the queue.
            </MessageBarBody>
          </MessageBar>
          <ResultTable result={done} />
        </Card>
      )}
    </>
  );
}
