import {
  Bar,
  BarChart,
  CartesianGrid,
  Cell,
  LabelList,
  Line,
  LineChart,
  ReferenceArea,
  ReferenceLine,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import { Caption1, Subtitle2, makeStyles, tokens } from '@fluentui/react-components';
import type { KpiName, LabourReport } from '@baytime/shared';
import {
  KPI_LABELS,
  KPI_NAMES,
  drawnBars,
  guidelineText,
  percentAxisMax,
  percentTicks,
  ratioBars,
  trendPoints,
} from '../report-format';
import { usePrinting } from '../hooks/use-printing';

/** Sizes that fit a portrait A4 or Letter page with 12 mm margins (about 700 CSS px across). */
const PRINT = { small: { width: 224, height: 190 }, trend: { width: 680, height: 230 } };
const SCREEN_HEIGHT = { small: 230, trend: 260 };
/**
 * Beyond this many bars (technicians and the shop) upright bars grow too thin for their names and
 * figures, so each technician gets a row instead: a shop of forty still reads name by name.
 */
const UPRIGHT_MAX_BARS = 10;
/** Height of one technician's row in a sideways chart, and what its axis and margins add. */
const ROW_HEIGHT = { screen: 22, print: 13 };
const SIDEWAYS_EXTRA_HEIGHT = 34;
const NAME_AXIS_WIDTH = 96;

/** Distinct line styles as well as colours, so the trend reads in greyscale and for colour-blind eyes. */
const TREND_LOOK: Record<KpiName, { stroke: string; dash?: string }> = {
  productivity: { stroke: tokens.colorBrandForeground1 },
  efficiency: { stroke: tokens.colorNeutralForeground1, dash: '7 4' },
  proficiency: { stroke: tokens.colorNeutralForeground3, dash: '2 3' },
};

const useStyles = makeStyles({
  block: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS, breakInside: 'avoid' },
  smalls: {
    display: 'grid',
    gridTemplateColumns: 'repeat(3, minmax(0, 1fr))',
    gap: tokens.spacingHorizontalL,
    '@media print': { gridTemplateColumns: `repeat(3, ${PRINT.small.width}px)`, gap: '4px' },
  },
  figure: {
    margin: 0,
    minWidth: 0,
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalXXS,
  },
  caption: { color: tokens.colorNeutralForeground2 },
  legend: {
    display: 'flex',
    gap: tokens.spacingHorizontalL,
    flexWrap: 'wrap',
    color: tokens.colorNeutralForeground2,
  },
  key: { display: 'inline-flex', alignItems: 'center', gap: tokens.spacingHorizontalXS },
});

const axisTick = { fill: tokens.colorNeutralForeground2, fontSize: 12 };
const percentTick = (value: number) => `${value}%`;

function RatioChart({ report, kpi, printing }: { report: LabourReport; kpi: KpiName; printing: boolean }) {
  const styles = useStyles();
  const guide = report.guidelines[kpi];
  const ratios = ratioBars(report, kpi);
  const max = percentAxisMax(
    ratios.map((bar) => bar.value),
    [guide.high],
  );
  const bars = drawnBars(ratios, max);
  const cut = bars.filter((bar) => bar.cut);
  const sideways = bars.length > UPRIGHT_MAX_BARS;
  const height = sideways
    ? bars.length * (printing ? ROW_HEIGHT.print : ROW_HEIGHT.screen) + SIDEWAYS_EXTRA_HEIGHT
    : printing
      ? PRINT.small.height
      : SCREEN_HEIGHT.small;
  const size = printing
    ? { width: PRINT.small.width, height }
    : { responsive: true, style: { width: '100%', height } };
  const percentAxis = {
    type: 'number' as const,
    domain: [0, max],
    ticks: percentTicks(max),
    tickFormatter: percentTick,
    tick: axisTick,
  };
  const nameAxis = {
    type: 'category' as const,
    dataKey: 'name',
    tick: axisTick,
    interval: 0,
    tickLine: false,
  };
  const summary = bars
    .map((bar) => `${bar.name} ${bar.value === null ? 'no time' : `${bar.value}%`}`)
    .join(', ');
  return (
    <figure className={styles.figure}>
      <Subtitle2 as="h4">{KPI_LABELS[kpi]}</Subtitle2>
      <Caption1 className={styles.caption}>
        Guideline {guidelineText(guide)}
        {cut.length > 0 &&
          ` · axis stops at ${max}%: ${cut.map((bar) => bar.name).join(', ')} cut, true figure on the bar`}
      </Caption1>
      <div
        role="img"
        aria-label={`${KPI_LABELS[kpi]} this week: ${summary}. Guideline ${guidelineText(guide)}.`}
      >
        <BarChart
          {...size}
          data={bars}
          layout={sideways ? 'vertical' : 'horizontal'}
          margin={
            sideways ? { top: 4, right: 40, bottom: 0, left: 0 } : { top: 18, right: 8, bottom: 0, left: -14 }
          }
          accessibilityLayer={false}
        >
          <CartesianGrid vertical={sideways} horizontal={!sideways} stroke={tokens.colorNeutralStroke2} />
          {sideways ? (
            <>
              <XAxis {...percentAxis} />
              <YAxis {...nameAxis} width={NAME_AXIS_WIDTH} />
            </>
          ) : (
            <>
              <XAxis {...nameAxis} height={38} angle={-25} textAnchor="end" />
              <YAxis {...percentAxis} width={52} />
            </>
          )}
          {guide.low === guide.high ? (
            <ReferenceLine
              {...(sideways ? { x: guide.low * 100 } : { y: guide.low * 100 })}
              stroke={tokens.colorNeutralForeground1}
              strokeDasharray="5 3"
              strokeWidth={1.5}
              ifOverflow="extendDomain"
            />
          ) : (
            <ReferenceArea
              {...(sideways
                ? { x1: guide.low * 100, x2: guide.high * 100 }
                : { y1: guide.low * 100, y2: guide.high * 100 })}
              fill={tokens.colorNeutralForeground1}
              fillOpacity={0.18}
              stroke={tokens.colorNeutralForeground1}
              strokeDasharray="5 3"
              ifOverflow="extendDomain"
            />
          )}
          {!printing && (
            <Tooltip
              cursor={{ fill: tokens.colorNeutralBackground1Hover }}
              formatter={(_, __, item) => {
                const { value } = item.payload as { value: number | null };
                return [value === null ? 'no time' : `${String(value)}%`, KPI_LABELS[kpi]];
              }}
              contentStyle={{
                background: tokens.colorNeutralBackground1,
                border: `1px solid ${tokens.colorNeutralStroke1}`,
              }}
            />
          )}
          <Bar dataKey="plotted" isAnimationActive={false} maxBarSize={38}>
            {bars.map((bar) => (
              <Cell
                key={bar.name}
                fill={bar.shop ? tokens.colorNeutralForeground2 : tokens.colorBrandBackground}
              />
            ))}
            <LabelList
              dataKey="value"
              position={sideways ? 'right' : 'top'}
              fill={tokens.colorNeutralForeground1}
              fontSize={11}
              // A halo of the card's colour keeps a figure readable where a guideline runs through it.
              stroke={tokens.colorNeutralBackground1}
              strokeWidth={4}
              strokeLinejoin="round"
              paintOrder="stroke"
              formatter={(value) =>
                value === null || value === undefined ? '–' : `${Math.round(Number(value))}%`
              }
            />
          </Bar>
        </BarChart>
      </div>
    </figure>
  );
}

function TrendChart({ report, printing }: { report: LabourReport; printing: boolean }) {
  const styles = useStyles();
  const points = trendPoints(report.trend);
  const max = percentAxisMax(
    points.flatMap((p) => [p.productivity, p.efficiency, p.proficiency]),
    KPI_NAMES.map((kpi) => report.guidelines[kpi].high),
  );
  const size = printing
    ? { width: PRINT.trend.width, height: PRINT.trend.height }
    : { responsive: true, style: { width: '100%', height: SCREEN_HEIGHT.trend } };
  const last = points.at(-1);
  return (
    <figure className={styles.figure}>
      <div className={styles.legend} aria-hidden="true">
        {KPI_NAMES.map((kpi) => (
          <span key={kpi} className={styles.key}>
            <svg width="30" height="10">
              <line
                x1="0"
                x2="30"
                y1="5"
                y2="5"
                stroke={TREND_LOOK[kpi].stroke}
                strokeWidth="2.5"
                strokeDasharray={TREND_LOOK[kpi].dash}
              />
            </svg>
            {KPI_LABELS[kpi]}
          </span>
        ))}
      </div>
      <div
        role="img"
        aria-label={`The shop over ${points.length} weeks.${
          last
            ? ` Latest week, of ${last.short}: productivity ${last.productivity ?? '–'}%, efficiency ${last.efficiency ?? '–'}%, proficiency ${last.proficiency ?? '–'}%.`
            : ''
        }`}
      >
        <LineChart
          {...size}
          data={points}
          margin={{ top: 10, right: 16, bottom: 0, left: -14 }}
          accessibilityLayer={false}
        >
          <CartesianGrid vertical={false} stroke={tokens.colorNeutralStroke2} />
          <XAxis dataKey="short" tick={axisTick} tickLine={false} />
          <YAxis
            domain={[0, max]}
            ticks={percentTicks(max)}
            tickFormatter={percentTick}
            tick={axisTick}
            width={52}
          />
          <ReferenceLine y={100} stroke={tokens.colorNeutralStroke1} />
          {!printing && (
            <Tooltip
              formatter={(value, name) => [
                value === null ? 'no time' : `${String(value)}%`,
                KPI_LABELS[name as KpiName] ?? String(name),
              ]}
              labelFormatter={(label) => `Week of ${String(label)}`}
              contentStyle={{
                background: tokens.colorNeutralBackground1,
                border: `1px solid ${tokens.colorNeutralStroke1}`,
              }}
            />
          )}
          {KPI_NAMES.map((kpi) => (
            <Line
              key={kpi}
              dataKey={kpi}
              type="linear"
              stroke={TREND_LOOK[kpi].stroke}
              strokeWidth={2.5}
              strokeDasharray={TREND_LOOK[kpi].dash}
              dot={{ r: 3, fill: TREND_LOOK[kpi].stroke }}
              connectNulls={false}
              isAnimationActive={false}
            />
          ))}
        </LineChart>
      </div>
    </figure>
  );
}

/** Recharts is heavy: this module is loaded only when a labour report is on screen. */
export default function LabourCharts({ report, part }: { report: LabourReport; part: 'ratios' | 'trend' }) {
  const styles = useStyles();
  const printing = usePrinting();
  if (part === 'trend') return <TrendChart report={report} printing={printing} />;
  return (
    <div className={styles.smalls}>
      {KPI_NAMES.map((kpi) => (
        <RatioChart key={kpi} report={report} kpi={kpi} printing={printing} />
      ))}
    </div>
  );
}
