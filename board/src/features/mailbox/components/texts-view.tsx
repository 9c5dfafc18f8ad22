import {
  Body1,
  Caption1,
  Card,
  MessageBar,
  MessageBarBody,
  Spinner,
  Text,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { formatPhone } from '@baytime/shared';
import { formErrorText } from '@/lib/form-errors';
import { useTexts } from '../api/get-texts';
import { receivedText } from '../mailbox-format';

const useStyles = makeStyles({
  list: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalS,
    margin: 0,
    padding: 0,
    maxWidth: '48rem',
  },
  item: { listStyleType: 'none' },
  card: { padding: `${tokens.spacingVerticalM} ${tokens.spacingHorizontalL}`, gap: tokens.spacingVerticalXS },
  head: { display: 'flex', justifyContent: 'space-between', gap: tokens.spacingHorizontalM },
  when: { color: tokens.colorNeutralForeground3, fontVariantNumeric: 'tabular-nums' },
  body: { whiteSpace: 'pre-wrap', overflowWrap: 'anywhere' },
  empty: { padding: tokens.spacingHorizontalXL, gap: tokens.spacingVerticalS },
});

/** The local text box: every text Baytime sent while no SMS provider is set up, newest first. */
export function TextsView({ timeZone }: { timeZone: string | undefined }) {
  const styles = useStyles();
  const texts = useTexts();
  if (texts.isPending) return <Spinner label="Loading the texts…" />;
  if (texts.isError)
    return (
      <MessageBar intent="error">
        <MessageBarBody>{formErrorText(texts.error)}</MessageBarBody>
      </MessageBar>
    );
  if (texts.data.items.length === 0)
    return (
      <Card className={styles.empty}>
        <Text weight="semibold">No texts yet</Text>
        <Body1>
          Approval links and ready notices that Baytime texts to customers land here while no SMS provider is
          set up.
        </Body1>
      </Card>
    );
  const now = new Date(texts.dataUpdatedAt);
  return (
    <ul className={styles.list} aria-label="Texts">
      {texts.data.items.map((text) => (
        <li key={text.id} className={styles.item}>
          <Card className={styles.card}>
            <div className={styles.head}>
              <Text weight="semibold">To {formatPhone(text.to)}</Text>
              <Caption1 className={styles.when}>{receivedText(text.date, now, timeZone)}</Caption1>
            </div>
            <Body1 className={styles.body}>{text.body}</Body1>
          </Card>
        </li>
      ))}
    </ul>
  );
}
