import { useRef, type KeyboardEvent } from 'react';
import {
  Badge,
  Body1,
  Caption1,
  Card,
  MessageBar,
  MessageBarBody,
  Spinner,
  Subtitle1,
  Text,
  makeStyles,
  mergeClasses,
  shorthands,
  tokens,
} from '@fluentui/react-components';
import type { MailboxEntry } from '@baytime/shared';
import { formErrorText } from '@/lib/form-errors';
import { useMailMessage } from '../api/get-mail-message';
import { useMailbox } from '../api/get-mailbox';
import { formatBytes, receivedText, recipientsText, splitAddress } from '../mailbox-format';

const useStyles = makeStyles({
  panes: {
    display: 'grid',
    gridTemplateColumns: 'minmax(22rem, 2fr) minmax(0, 3fr)',
    gap: tokens.spacingHorizontalL,
    alignItems: 'start',
    '@media (max-width: 1100px)': { gridTemplateColumns: 'minmax(0, 1fr)' },
  },
  listCard: { padding: 0, overflow: 'hidden' },
  listHead: {
    padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalL}`,
    color: tokens.colorNeutralForeground3,
    ...shorthands.borderBottom(tokens.strokeWidthThin, 'solid', tokens.colorNeutralStroke2),
  },
  list: { listStyleType: 'none', margin: 0, padding: 0, maxHeight: 'calc(100vh - 14rem)', overflowY: 'auto' },
  row: {
    display: 'grid',
    gridTemplateColumns: 'minmax(0, 1fr) auto',
    gap: `${tokens.spacingVerticalXXS} ${tokens.spacingHorizontalM}`,
    width: '100%',
    padding: `${tokens.spacingVerticalM} ${tokens.spacingHorizontalL}`,
    textAlign: 'left',
    font: 'inherit',
    color: tokens.colorNeutralForeground1,
    backgroundColor: 'transparent',
    cursor: 'pointer',
    ...shorthands.border('0'),
    ...shorthands.borderBottom(tokens.strokeWidthThin, 'solid', tokens.colorNeutralStroke3),
    ':hover': { backgroundColor: tokens.colorNeutralBackground1Hover },
    ':focus-visible': { outline: `2px solid ${tokens.colorStrokeFocus2}`, outlineOffset: '-2px' },
  },
  selected: {
    backgroundColor: tokens.colorBrandBackground2,
    boxShadow: `inset 4px 0 0 ${tokens.colorBrandStroke1}`,
    ':hover': { backgroundColor: tokens.colorBrandBackground2Hover },
  },
  subject: {
    fontWeight: tokens.fontWeightSemibold,
    overflow: 'hidden',
    textOverflow: 'ellipsis',
    whiteSpace: 'nowrap',
  },
  when: {
    color: tokens.colorNeutralForeground3,
    whiteSpace: 'nowrap',
    fontVariantNumeric: 'tabular-nums',
    justifySelf: 'end',
    textAlign: 'right',
  },
  line: {
    color: tokens.colorNeutralForeground2,
    overflow: 'hidden',
    textOverflow: 'ellipsis',
    whiteSpace: 'nowrap',
    fontSize: tokens.fontSizeBase200,
  },
  reader: { padding: tokens.spacingHorizontalXL, gap: tokens.spacingVerticalM, minWidth: 0 },
  meta: {
    display: 'grid',
    gridTemplateColumns: 'max-content minmax(0, 1fr)',
    gap: `${tokens.spacingVerticalXS} ${tokens.spacingHorizontalL}`,
    margin: 0,
  },
  term: { color: tokens.colorNeutralForeground3 },
  value: { margin: 0, overflowWrap: 'anywhere' },
  files: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalXS },
  text: {
    margin: 0,
    padding: tokens.spacingHorizontalL,
    whiteSpace: 'pre-wrap',
    overflowWrap: 'anywhere',
    fontFamily: tokens.fontFamilyBase,
    fontSize: tokens.fontSizeBase400,
    lineHeight: tokens.lineHeightBase400,
    backgroundColor: tokens.colorNeutralBackground2,
    borderRadius: tokens.borderRadiusMedium,
    maxHeight: 'calc(100vh - 24rem)',
    minHeight: '10rem',
    overflowY: 'auto',
  },
  dim: { color: tokens.colorNeutralForeground3 },
  empty: { padding: tokens.spacingHorizontalXL, gap: tokens.spacingVerticalS },
});

function Reader({ id, timeZone }: { id: string; timeZone: string | undefined }) {
  const styles = useStyles();
  const message = useMailMessage(id);
  if (message.isPending) return <Spinner label="Opening the message…" />;
  if (message.isError)
    return (
      <MessageBar intent="error">
        <MessageBarBody>{formErrorText(message.error)}</MessageBarBody>
      </MessageBar>
    );
  const mail = message.data;
  const from = splitAddress(mail.from);
  const full = new Intl.DateTimeFormat('en-US', { dateStyle: 'full', timeStyle: 'short', timeZone });
  return (
    <>
      <Subtitle1 as="h2">{mail.subject || '(no subject)'}</Subtitle1>
      <dl className={styles.meta}>
        <dt className={styles.term}>From</dt>
        <dd className={styles.value}>{from.name ? `${from.name} <${from.address}>` : from.address}</dd>
        <dt className={styles.term}>To</dt>
        <dd className={styles.value}>{mail.to.join(', ') || '(no recipient)'}</dd>
        <dt className={styles.term}>Received</dt>
        <dd className={styles.value}>{full.format(new Date(mail.date))}</dd>
        <dt className={styles.term}>Size</dt>
        <dd className={styles.value}>{formatBytes(mail.sizeBytes)}</dd>
        <dt className={styles.term}>Attachments</dt>
        <dd className={styles.value}>
          {mail.attachments.length === 0 ? (
            <span className={styles.dim}>none</span>
          ) : (
            <span className={styles.files}>
              {mail.attachments.map((name, index) => (
                <Badge key={`${name}-${index}`} appearance="outline" color="informative">
                  {name}
                </Badge>
              ))}
            </span>
          )}
        </dd>
      </dl>
      <pre className={styles.text} tabIndex={0} aria-label="Message text">
        {mail.text.trim() || '(no text part)'}
      </pre>
    </>
  );
}

/** The local test mailbox: the list on the left, the chosen message on the right; ↑ ↓ move through the list. */
export function MailboxView({
  selected,
  onSelect,
  timeZone,
}: {
  selected: string | null;
  onSelect: (id: string) => void;
  timeZone: string | undefined;
}) {
  const styles = useStyles();
  const mailbox = useMailbox();
  const list = useRef<HTMLUListElement>(null);

  if (mailbox.isPending) return <Spinner label="Loading the mailbox…" />;
  if (mailbox.isError)
    return (
      <MessageBar intent="error">
        <MessageBarBody>{formErrorText(mailbox.error)}</MessageBarBody>
      </MessageBar>
    );
  const messages = mailbox.data.items;
  if (messages.length === 0)
    return (
      <Card className={styles.empty}>
        <Text weight="semibold">No messages yet</Text>
        <Body1>
          Approval requests, ready notices and new-finding alerts that Baytime sends land here while no
          outgoing mail server is set up.
        </Body1>
      </Card>
    );

  // The newest message is open until another is chosen.
  const current = messages.find((mail) => mail.id === selected) ?? messages[0] ?? null;
  const now = new Date(mailbox.dataUpdatedAt);
  const move = (event: KeyboardEvent, index: number) => {
    const next =
      event.key === 'ArrowDown'
        ? index + 1
        : event.key === 'ArrowUp'
          ? index - 1
          : event.key === 'Home'
            ? 0
            : event.key === 'End'
              ? messages.length - 1
              : null;
    if (next === null || next < 0 || next >= messages.length) return;
    event.preventDefault();
    onSelect(messages[next]!.id);
    list.current?.querySelectorAll<HTMLButtonElement>('button')[next]?.focus();
  };
  const row = (mail: MailboxEntry, index: number) => (
    <li key={mail.id}>
      <button
        type="button"
        className={mergeClasses(styles.row, mail.id === current?.id && styles.selected)}
        aria-current={mail.id === current?.id ? 'true' : undefined}
        onClick={() => onSelect(mail.id)}
        onKeyDown={(event) => move(event, index)}
      >
        <span className={styles.subject}>{mail.subject || '(no subject)'}</span>
        <Caption1 className={styles.when}>{receivedText(mail.date, now, timeZone)}</Caption1>
        <span className={styles.line}>
          To {recipientsText(mail.to)} · from{' '}
          {splitAddress(mail.from).name ?? splitAddress(mail.from).address}
        </span>
        <Caption1 className={styles.when}>
          {mail.attachments.length > 0 &&
            `${mail.attachments.length} attachment${mail.attachments.length === 1 ? '' : 's'} · `}
          {formatBytes(mail.sizeBytes)}
        </Caption1>
      </button>
    </li>
  );

  return (
    <div className={styles.panes}>
      <Card className={styles.listCard}>
        <Caption1 className={styles.listHead}>
          {mailbox.data.total > messages.length
            ? `The newest ${messages.length} of ${mailbox.data.total.toLocaleString('en-US')} messages`
            : `${messages.length} message${messages.length === 1 ? '' : 's'}, newest first`}
        </Caption1>
        <ul className={styles.list} ref={list} aria-label="Messages">
          {messages.map(row)}
        </ul>
      </Card>
      <Card className={styles.reader} role="region" aria-label="Message">
        {current ? (
          <Reader id={current.id} timeZone={timeZone} />
        ) : (
          <Body1 className={styles.dim}>Choose a message to read it.</Body1>
        )}
      </Card>
    </div>
  );
}
