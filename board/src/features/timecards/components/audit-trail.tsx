import {
  Caption1,
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
import type { Timecard } from '@baytime/shared';
import { auditText, formatDayClock } from '../timecard-format';

const useStyles = makeStyles({
  section: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
  table: { tableLayout: 'auto' },
  when: { whiteSpace: 'nowrap', width: '12rem' },
  dim: { color: tokens.colorNeutralForeground3 },
});

/** Every change to the card's punches: who, when, what and why, newest first. */
export function AuditTrail({ card }: { card: Timecard }) {
  const styles = useStyles();
  return (
    <section className={styles.section} aria-labelledby="audit-title">
      <Subtitle2 as="h2" id="audit-title">
        Changes to this card
      </Subtitle2>
      {card.audit.length === 0 ? (
        <Caption1 className={styles.dim}>
          No corrections on this card. A clock-off the office made by moving, holding or finishing a line
          shows on its punch, with why.
        </Caption1>
      ) : (
        <Table size="small" className={styles.table} aria-label="Changes to this card">
          <TableHeader>
            <TableRow>
              <TableHeaderCell className={styles.when}>When</TableHeaderCell>
              <TableHeaderCell>Who</TableHeaderCell>
              <TableHeaderCell>What</TableHeaderCell>
              <TableHeaderCell>Punch and reason</TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            {card.audit.map((entry, index) => {
              const text = auditText(entry, card.timeZone);
              return (
                <TableRow key={`${entry.at}-${index}`}>
                  <TableCell className={styles.when}>{formatDayClock(entry.at, card.timeZone)}</TableCell>
                  <TableCell>{entry.actor}</TableCell>
                  <TableCell>{text.action}</TableCell>
                  <TableCell>{text.detail}</TableCell>
                </TableRow>
              );
            })}
          </TableBody>
        </Table>
      )}
    </section>
  );
}
