import { Link } from 'react-router';
import { Badge, Caption1, Subtitle2, Text, makeStyles, tokens } from '@fluentui/react-components';
import { EXCEPTION_TITLES, flaggedWhenClosed, formatBookHours, type Timecard } from '@baytime/shared';
import { paths } from '@/config/paths';
import { formatMoney } from '@/lib/form-errors';
import { PUNCH_WORDS, formatDayClock } from '../timecard-format';

const useStyles = makeStyles({
  section: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
  figures: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalXXL, margin: 0 },
  figure: { display: 'flex', flexDirection: 'column', margin: 0 },
  term: { color: tokens.colorNeutralForeground2, fontSize: tokens.fontSizeBase200 },
  value: {
    margin: 0,
    fontSize: tokens.fontSizeBase500,
    fontWeight: tokens.fontWeightSemibold,
    fontVariantNumeric: 'tabular-nums',
  },
  list: {
    margin: 0,
    paddingLeft: tokens.spacingHorizontalL,
    display: 'flex',
    flexDirection: 'column',
    gap: '4px',
  },
  dim: { color: tokens.colorNeutralForeground3 },
  warn: { color: tokens.colorPaletteRedForeground1 },
});

const percent = (ratio: number | null) => (ratio === null ? '–' : `${Math.round(ratio * 100)}%`);

/**
 * The week as the reports count it (the same figures as the labour report and, for the owner, the pay
 * summary), with the week's exceptions and late punches held for review, which the Exceptions page resolves.
 */
export function WeekReview({ card }: { card: Timecard }) {
  const styles = useStyles();
  const { labour, pay } = card.summary;
  const paidOn = flaggedWhenClosed(card.summary);
  const exceptionsLink = `${paths.exceptions}?week=${encodeURIComponent(card.week)}`;
  const open = card.exceptions.filter((e) => e.resolution === null);
  return (
    <section className={styles.section} aria-labelledby="week-review-title">
      <Subtitle2 as="h2" id="week-review-title">
        In the reports
      </Subtitle2>
      <dl className={styles.figures}>
        {(
          [
            ['Flagged', formatBookHours(labour.flaggedHours)],
            ...(paidOn !== null ? [['Flagged when the week closed', formatBookHours(paidOn)] as const] : []),
            ['Efficiency', percent(labour.efficiency)],
            ['Work in progress', formatBookHours(labour.workInProgressHours)],
            ...(pay ? [['Estimated pay this week', formatMoney(pay.payableCents)] as const] : []),
          ] as const
        ).map(([term, value]) => (
          <div key={term} className={styles.figure}>
            <dt className={styles.term}>{term}</dt>
            <dd className={styles.value}>{value}</dd>
          </div>
        ))}
      </dl>
      {pay?.payableCaution && (
        <Text weight="semibold" className={styles.warn}>
          {pay.payableCaution}
        </Text>
      )}
      {pay && <Caption1 className={styles.dim}>{card.summary.caution}</Caption1>}
      {card.held.length > 0 && (
        <>
          <Text weight="semibold">Late punches held for review</Text>
          <ul className={styles.list}>
            {card.held.map((held) => (
              <li key={held.id}>
                {PUNCH_WORDS[held.kind]} at {formatDayClock(held.at, card.timeZone)}:{' '}
                {held.review === 'pending' ? (
                  <Badge appearance="tint" color="danger" size="small">
                    not counted until the foreman decides
                  </Badge>
                ) : (
                  <Badge
                    appearance="tint"
                    color={held.review === 'accepted' ? 'brand' : 'subtle'}
                    size="small"
                  >
                    {held.review}
                  </Badge>
                )}{' '}
                <Caption1 className={styles.dim}>{held.heldBecause}</Caption1>
              </li>
            ))}
          </ul>
        </>
      )}
      {card.exceptions.length > 0 ? (
        <>
          <Text weight="semibold">
            Exceptions: {open.length} to resolve, {card.exceptions.length - open.length} resolved ·{' '}
            <Link to={exceptionsLink}>resolve them on the Exceptions page</Link>
          </Text>
          <ul className={styles.list}>
            {card.exceptions.map((exception) => (
              <li key={exception.key}>
                <strong>{EXCEPTION_TITLES[exception.kind]}</strong>
                {exception.resolution ? ' (resolved)' : ''}: {exception.text}
              </li>
            ))}
          </ul>
        </>
      ) : (
        <Caption1 className={styles.dim}>No exceptions this week.</Caption1>
      )}
    </section>
  );
}
