import type { ReactNode } from 'react';
import {
  Badge,
  Caption1,
  Card,
  Text,
  makeStyles,
  shorthands,
  mergeClasses,
  tokens,
} from '@fluentui/react-components';
import {
  FINDING_SEVERITY_ICONS,
  FINDING_SEVERITY_LABELS,
  lineStatusWords,
  formatCents,
  waitWords,
  type FindingDto,
  type FindingSeverity,
} from '@baytime/shared';
import { Glyph } from '@/components/glyph';
import { FindingPhotos } from './finding-photos';

const SEVERITY_COLOUR: Record<FindingSeverity, 'danger' | 'important' | 'informative'> = {
  'safety-now': 'danger',
  soon: 'important',
  watch: 'informative',
};

const useStyles = makeStyles({
  card: {
    padding: `${tokens.spacingVerticalL} ${tokens.spacingHorizontalXL}`,
    gap: tokens.spacingVerticalS,
  },
  safety: { boxShadow: `inset 5px 0 0 ${tokens.colorPaletteRedBorder2}, ${tokens.shadow4}` },
  fresh: { outline: `2px solid ${tokens.colorBrandStroke1}`, outlineOffset: '-1px' },
  layout: {
    display: 'grid',
    gridTemplateColumns: 'minmax(0, 1fr) auto',
    gap: tokens.spacingHorizontalXXL,
    '@media (max-width: 1150px)': { gridTemplateColumns: 'minmax(0, 1fr)' },
  },
  text: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXS, minWidth: 0 },
  head: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', gap: tokens.spacingHorizontalM },
  ro: {
    fontSize: tokens.fontSizeBase500,
    fontWeight: tokens.fontWeightSemibold,
    fontVariantNumeric: 'tabular-nums',
  },
  badgeGlyph: { width: '1em', height: '1em' },
  meta: { color: tokens.colorNeutralForeground2 },
  note: {
    margin: `${tokens.spacingVerticalXS} 0`,
    padding: `${tokens.spacingVerticalXS} ${tokens.spacingHorizontalM}`,
    ...shorthands.borderLeft(tokens.strokeWidthThicker, 'solid', tokens.colorNeutralStroke1),
    fontSize: tokens.fontSizeBase400,
    lineHeight: tokens.lineHeightBase400,
    whiteSpace: 'pre-wrap',
  },
  facts: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: `${tokens.spacingVerticalXXS} ${tokens.spacingHorizontalL}`,
  },
  actions: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: tokens.spacingHorizontalS,
    marginTop: tokens.spacingVerticalS,
  },
  dim: { color: tokens.colorNeutralForeground3 },
  quote: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalXXS,
    padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalM}`,
    borderRadius: tokens.borderRadiusMedium,
    backgroundColor: tokens.colorNeutralBackground3,
  },
  price: { fontVariantNumeric: 'tabular-nums' },
});

/** The advisor's reviewed wording and price: what the customer's page will show. */
function QuoteSummary({ finding }: { finding: FindingDto }) {
  const styles = useStyles();
  if (finding.customerWording === null || finding.bookHours === null)
    return <Caption1 className={styles.dim}>Not yet reviewed for the customer.</Caption1>;
  return (
    <div className={styles.quote} aria-label="For the customer">
      <Caption1 className={styles.dim}>For the customer</Caption1>
      <Text>{finding.customerWording}</Text>
      <Caption1 className={styles.price}>
        {finding.bookHours} h{finding.partsCents ? ` + parts ${formatCents(finding.partsCents)}` : ''}
        {finding.priceCents !== null && ` = ${formatCents(finding.priceCents)}`}
      </Caption1>
    </div>
  );
}

export function SeverityBadge({ severity }: { severity: FindingSeverity }) {
  const styles = useStyles();
  return (
    <Badge
      appearance={severity === 'safety-now' ? 'filled' : 'tint'}
      color={SEVERITY_COLOUR[severity]}
      size="large"
      icon={<Glyph name={FINDING_SEVERITY_ICONS[severity]} className={styles.badgeGlyph} />}
    >
      {FINDING_SEVERITY_LABELS[severity]}
    </Badge>
  );
}

const lineState = (finding: FindingDto) =>
  lineStatusWords({ status: finding.lineStatus, holdReason: finding.holdReason });

/** One pending finding: what, where, who, how urgent, photos, and what the advisor can do next. */
export function FindingCard({
  finding,
  isNew,
  now,
  formatWhen,
  actions,
  status,
}: {
  finding: FindingDto;
  isNew: boolean;
  now: number;
  formatWhen: (iso: string) => string;
  actions: ReactNode;
  /** A line under the actions: what was sent, or why something cannot be. */
  status?: ReactNode;
}) {
  const styles = useStyles();
  const title = `RO ${finding.repairOrderNumber}, line ${finding.lineNo}`;
  const waited = waitWords(Date.parse(finding.createdAt), now);
  const ago = waited === 'just now' ? waited : `${waited} ago`;
  return (
    <Card
      className={mergeClasses(
        styles.card,
        finding.severity === 'safety-now' && styles.safety,
        isNew && styles.fresh,
      )}
      aria-labelledby={`finding-${finding.id}`}
    >
      <div className={styles.layout}>
        <div className={styles.text}>
          <div className={styles.head}>
            <SeverityBadge severity={finding.severity} />
            <span className={styles.ro} id={`finding-${finding.id}`}>
              RO {finding.repairOrderNumber}
            </span>
            <Text>{finding.vehicle}</Text>
            <Text className={styles.meta}>· {finding.customerName}</Text>
            {isNew && (
              <Badge appearance="outline" color="brand" size="small">
                new
              </Badge>
            )}
          </div>
          <Text className={styles.meta}>
            Line {finding.lineNo} · {finding.lineTitle}{' '}
            <span className={styles.dim}>({lineState(finding)})</span>
          </Text>
          <blockquote className={styles.note}>{finding.note}</blockquote>
          <div className={styles.facts}>
            <Caption1>
              Found by <strong>{finding.technicianName}</strong>, {formatWhen(finding.createdAt)} ({ago})
            </Caption1>
            <Caption1>
              {finding.suggestedHours === null ? (
                'No time suggested'
              ) : (
                <>
                  Suggested <strong>{finding.suggestedHours} h</strong>
                </>
              )}
            </Caption1>
          </div>
          <QuoteSummary finding={finding} />
          <div className={styles.actions}>{actions}</div>
          {status}
        </div>
        <FindingPhotos photos={finding.photos} title={title} />
      </div>
    </Card>
  );
}
