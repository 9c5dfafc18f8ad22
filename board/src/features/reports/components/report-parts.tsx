import type { ReactNode } from 'react';
import { Caption1, Card, makeStyles, mergeClasses, tokens } from '@fluentui/react-components';

const useStyles = makeStyles({
  stats: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fit, minmax(9.5rem, 1fr))',
    gap: tokens.spacingHorizontalM,
    breakInside: 'avoid',
  },
  stat: {
    padding: `${tokens.spacingVerticalM} ${tokens.spacingHorizontalL}`,
    gap: tokens.spacingVerticalXXS,
    '@media print': { padding: '4px 8px', boxShadow: 'none', border: '1px solid #999' },
  },
  label: { color: tokens.colorNeutralForeground2 },
  value: {
    fontSize: tokens.fontSizeHero700,
    lineHeight: tokens.lineHeightHero700,
    fontWeight: tokens.fontWeightSemibold,
    fontVariantNumeric: 'tabular-nums',
    '@media print': { fontSize: '18pt', lineHeight: '1.2' },
  },
  note: { color: tokens.colorNeutralForeground3 },
  alert: { color: tokens.colorStatusWarningForeground1, fontWeight: tokens.fontWeightSemibold },
  section: {
    padding: tokens.spacingHorizontalXL,
    gap: tokens.spacingVerticalM,
    '@media print': { padding: '0', boxShadow: 'none', border: 'none', gap: '6px' },
  },
});

export function StatGrid({ children }: { children: ReactNode }) {
  return <div className={useStyles().stats}>{children}</div>;
}

export function Stat({
  label,
  value,
  note,
  alert,
}: {
  label: string;
  value: string;
  note?: ReactNode;
  /** Draws the note as something to look at, in words as well as colour. */
  alert?: boolean;
}) {
  const styles = useStyles();
  return (
    <Card className={styles.stat} appearance="filled-alternative">
      <Caption1 className={styles.label}>{label}</Caption1>
      <span className={styles.value}>{value}</span>
      {note && <Caption1 className={alert ? styles.alert : styles.note}>{note}</Caption1>}
    </Card>
  );
}

export function ReportSection({
  children,
  className,
  labelledBy,
}: {
  children: ReactNode;
  className?: string;
  labelledBy?: string;
}) {
  const styles = useStyles();
  return (
    <Card className={mergeClasses(styles.section, className)} role="region" aria-labelledby={labelledBy}>
      {children}
    </Card>
  );
}
