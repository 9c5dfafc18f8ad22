import { Fragment, Suspense, lazy, useState } from 'react';
import {
  Button,
  Caption1,
  Spinner,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  Text,
  makeStyles,
  mergeClasses,
  shorthands,
  tokens,
} from '@fluentui/react-components';
import {
  HOURS_ROUNDING_RULE,
  type KpiName,
  type LabourReport,
  type LabourReportRow,
  type LabourReportTechnician,
} from '@baytime/shared';
import {
  KPI_LABELS,
  KPI_NAMES,
  formatHours,
  formatPercent,
  guidelineText,
  versusGuideline,
} from '../report-format';
import { BayUtilisationTable } from './bay-utilisation';
import { ChartBoundary } from './chart-boundary';
import { ReportSection, Stat, StatGrid } from './report-parts';
import { TechnicianLines } from './technician-lines';

const LabourCharts = lazy(() => import('./labour-charts'));

const useStyles = makeStyles({
  stack: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  formulas: {
    margin: 0,
    paddingLeft: tokens.spacingHorizontalL,
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalXS,
  },
  formula: { fontSize: tokens.fontSizeBase400 },
  guide: { color: tokens.colorNeutralForeground3 },
  names: { color: tokens.colorNeutralForeground2, fontStyle: 'italic' },
  chartSlot: { minHeight: '17rem', display: 'grid', alignItems: 'center' },
  trendSlot: { minHeight: '18rem', display: 'grid', alignItems: 'center' },
  table: { tableLayout: 'auto' },
  numButton: { justifyContent: 'flex-end', textAlign: 'right' },
  num: { textAlign: 'right', fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap' },
  nameCell: { minWidth: '12rem' },
  below: { color: tokens.colorStatusWarningForeground1, fontWeight: tokens.fontWeightSemibold },
  shopRow: {
    fontWeight: tokens.fontWeightSemibold,
    ...shorthands.borderTop(tokens.strokeWidthThick, 'solid', tokens.colorNeutralStroke1),
  },
  expander: { minWidth: 0, fontWeight: tokens.fontWeightSemibold, justifyContent: 'flex-start' },
  drill: {
    backgroundColor: tokens.colorNeutralBackground2,
    ':hover': { backgroundColor: tokens.colorNeutralBackground2 },
  },
  drillCell: {
    padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalL} ${tokens.spacingVerticalM}`,
  },
  dim: { color: tokens.colorNeutralForeground3 },
  scroll: { overflowX: 'auto' },
});

function Ratio({ value, kpi, report }: { value: number | null; kpi: KpiName; report: LabourReport }) {
  const styles = useStyles();
  const mark = versusGuideline(value, report.guidelines[kpi]);
  return (
    <span className={mark === 'below' ? styles.below : undefined}>
      {formatPercent(value)}
      {mark === 'below' && (
        <>
          <span aria-hidden="true"> ▼</span>
          <span className="visually-hidden"> (below the guideline)</span>
        </>
      )}
    </span>
  );
}

function Figures({ row, report }: { row: LabourReportRow; report: LabourReport }) {
  const styles = useStyles();
  return (
    <>
      <TableCell className={styles.num}>{formatHours(row.attendanceHours)}</TableCell>
      <TableCell className={styles.num}>{formatHours(row.clockedHours)}</TableCell>
      <TableCell className={styles.num}>{formatHours(row.flaggedHours)}</TableCell>
      <TableCell className={styles.num}>{formatHours(row.matchedClockedHours)}</TableCell>
      <TableCell className={styles.num}>{formatHours(row.workInProgressHours)}</TableCell>
      {KPI_NAMES.map((kpi) => (
        <TableCell key={kpi} className={styles.num}>
          <Ratio value={row[kpi]} kpi={kpi} report={report} />
        </TableCell>
      ))}
    </>
  );
}

function TechnicianTable({ report }: { report: LabourReport }) {
  const styles = useStyles();
  const [open, setOpen] = useState<ReadonlySet<number>>(new Set());
  const toggle = (id: number) =>
    setOpen((current) => {
      const next = new Set(current);
      if (!next.delete(id)) next.add(id);
      return next;
    });
  const row = (tech: LabourReportTechnician) => {
    const expanded = open.has(tech.technicianId);
    return (
      <Fragment key={tech.technicianId}>
        <TableRow>
          <TableCell className={styles.nameCell}>
            <span className="bt-print-only">
              <Text weight="semibold">{tech.name}</Text>
            </span>
            <Button
              appearance="transparent"
              className={mergeClasses('bt-no-print', styles.expander)}
              aria-expanded={expanded}
              aria-controls={`lines-${tech.technicianId}`}
              onClick={() => toggle(tech.technicianId)}
              disabled={tech.lines.length === 0}
            >
              <span aria-hidden="true">{expanded ? '▾' : '▸'}&nbsp;</span>
              {tech.name}
            </Button>
            <Caption1 className={styles.dim}>
              {tech.lines.length === 0
                ? 'no lines'
                : `${tech.lines.length} line${tech.lines.length === 1 ? '' : 's'}`}
            </Caption1>
          </TableCell>
          <Figures row={tech} report={report} />
        </TableRow>
        {expanded && (
          <TableRow className={styles.drill} id={`lines-${tech.technicianId}`}>
            <TableCell colSpan={9} className={styles.drillCell}>
              <TechnicianLines technician={tech} />
            </TableCell>
          </TableRow>
        )}
      </Fragment>
    );
  };
  return (
    <div className={mergeClasses('bt-print-wide', styles.scroll)}>
      <Table className={styles.table} aria-label="Labour per technician">
        <TableHeader>
          <TableRow>
            <TableHeaderCell>Technician</TableHeaderCell>
            <TableHeaderCell className={styles.num} button={{ className: styles.numButton }}>
              Attendance h
            </TableHeaderCell>
            <TableHeaderCell className={styles.num} button={{ className: styles.numButton }}>
              Clocked on jobs h
            </TableHeaderCell>
            <TableHeaderCell className={styles.num} button={{ className: styles.numButton }}>
              Flagged h
            </TableHeaderCell>
            <TableHeaderCell className={styles.num} button={{ className: styles.numButton }}>
              Clocked on those lines h
            </TableHeaderCell>
            <TableHeaderCell className={styles.num} button={{ className: styles.numButton }}>
              Work in progress h
            </TableHeaderCell>
            {KPI_NAMES.map((kpi) => (
              <TableHeaderCell key={kpi} className={styles.num} button={{ className: styles.numButton }}>
                {KPI_LABELS[kpi]}
              </TableHeaderCell>
            ))}
          </TableRow>
        </TableHeader>
        <TableBody>
          {report.technicians.map(row)}
          <TableRow className={styles.shopRow}>
            <TableCell>Shop (hours summed, then divided)</TableCell>
            <Figures row={report.shop} report={report} />
          </TableRow>
        </TableBody>
      </Table>
    </div>
  );
}

export function LabourReportView({ report }: { report: LabourReport }) {
  const styles = useStyles();
  const { shop } = report;
  const guideNote = (kpi: KpiName) => {
    const mark = versusGuideline(shop[kpi], report.guidelines[kpi]);
    const guide = `guideline ${guidelineText(report.guidelines[kpi])}`;
    return mark === 'below'
      ? `Below the ${guide}`
      : mark === 'above'
        ? `Above the ${guide}`
        : `Within the ${guide}`;
  };
  return (
    <div className={styles.stack}>
      <StatGrid>
        <Stat
          label="Attendance"
          value={`${formatHours(shop.attendanceHours)} h`}
          note="Shift time less meal breaks"
        />
        <Stat
          label="Clocked on jobs"
          value={`${formatHours(shop.clockedHours)} h`}
          note="Real time on job lines"
        />
        <Stat
          label="Flagged"
          value={`${formatHours(shop.flaggedHours)} h`}
          note="Book hours of lines finished"
        />
        <Stat
          label="Work in progress"
          value={`${formatHours(shop.workInProgressHours)} h`}
          note="Clocked on lines not finished yet"
        />
        {KPI_NAMES.map((kpi) => (
          <Stat
            key={kpi}
            label={`Shop ${KPI_LABELS[kpi].toLowerCase()}`}
            value={formatPercent(shop[kpi])}
            note={shop[kpi] === null ? 'No time to divide by' : guideNote(kpi)}
            alert={versusGuideline(shop[kpi], report.guidelines[kpi]) === 'below'}
          />
        ))}
      </StatGrid>

      <ReportSection labelledBy="formulas-title">
        <Subtitle2 as="h2" id="formulas-title">
          How the ratios are worked out
        </Subtitle2>
        <ul className={styles.formulas}>
          {KPI_NAMES.map((kpi) => (
            <li key={kpi}>
              <Text className={styles.formula}>{report.formulas[kpi]}</Text>{' '}
              <Caption1 className={styles.guide}>
                · guideline {guidelineText(report.guidelines[kpi])}
              </Caption1>
            </li>
          ))}
        </ul>
        <Caption1 className={styles.names}>{report.efficiencyNote}</Caption1>
        <Caption1 className={styles.names}>{report.namesNote}</Caption1>
      </ReportSection>

      <ReportSection labelledBy="ratios-title">
        <Subtitle2 as="h2" id="ratios-title">
          Each technician this week
        </Subtitle2>
        <Caption1 className={styles.dim}>
          Dashed lines and shaded bands are the guidelines; the grey bar is the shop. The same figures are in
          the table below.
        </Caption1>
        <div className={styles.chartSlot}>
          <ChartBoundary>
            <Suspense fallback={<Spinner size="small" label="Drawing the charts…" />}>
              <LabourCharts report={report} part="ratios" />
            </Suspense>
          </ChartBoundary>
        </div>
      </ReportSection>

      <ReportSection labelledBy="technicians-title">
        <Subtitle2 as="h2" id="technicians-title">
          Hours and ratios per technician
        </Subtitle2>
        <Caption1 className={styles.dim}>
          Open a technician to see their job lines: book against actual time.
        </Caption1>
        <TechnicianTable report={report} />
        <Caption1 className={styles.dim}>
          The shop row adds up every technician with hours in the week, to the second. {HOURS_ROUNDING_RULE}
        </Caption1>
      </ReportSection>

      <ReportSection labelledBy="trend-title">
        <Subtitle2 as="h2" id="trend-title">
          The shop, last {report.trend.length} weeks
        </Subtitle2>
        <div className={styles.trendSlot}>
          <ChartBoundary>
            <Suspense fallback={<Spinner size="small" label="Drawing the chart…" />}>
              <LabourCharts report={report} part="trend" />
            </Suspense>
          </ChartBoundary>
        </div>
      </ReportSection>

      <ReportSection labelledBy="bays-title">
        <Subtitle2 as="h2" id="bays-title">
          Bay use
        </Subtitle2>
        <Caption1 className={styles.dim}>
          Share of each day’s opening hours the bay was not free. Closed days and days still to come are
          blank.
        </Caption1>
        <BayUtilisationTable report={report} />
      </ReportSection>
    </div>
  );
}
