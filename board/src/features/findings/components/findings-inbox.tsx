import { useCallback, useEffect, useMemo, useState, useSyncExternalStore } from 'react';
import { dayClockTime } from '@/lib/shop-clock';
import { Link as RouterLink } from 'react-router';
import { paths } from '@/config/paths';
import {
  Badge,
  Body1,
  Button,
  Caption1,
  Card,
  CounterBadge,
  MessageBar,
  MessageBarActions,
  MessageBarBody,
  Spinner,
  Subtitle2,
  Tab,
  TabList,
  Text,
  makeStyles,
  shorthands,
  tokens,
} from '@fluentui/react-components';
import {
  FINDING_ANSWER_WORDS,
  formatBookHours,
  lineWords,
  sentToWords,
  type FindingAnswerResult,
  type FindingDto,
} from '@baytime/shared';
import { formErrorText } from '@/lib/form-errors';
import { useFindings } from '../api/get-findings';
import { useRequestApproval } from '../api/request-approval';
import { useRevokeApprovalLink } from '../api/revoke-approval-link';
import {
  answeredText,
  groupAnswered,
  linkStateText,
  sortPending,
  type AnsweredGroup,
} from '../findings-model';
import { findingArrivals } from '@/lib/finding-arrivals';
import { useMinuteNow } from '@/hooks/use-minute-now';
import { ApproveDialog, ChangeAnswerDialog, DeclineDialog } from './answer-dialogs';
import { FindingCard, SeverityBadge } from './finding-card';
import { FindingPhotos } from './finding-photos';
import { QuoteDialog } from './quote-dialog';

export type InboxTab = 'pending' | 'answered';
export type InboxRole = 'owner' | 'foreman' | 'advisor';

const useStyles = makeStyles({
  page: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL, maxWidth: '90rem' },
  bar: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalM, flexWrap: 'wrap' },
  tabCount: { marginLeft: tokens.spacingHorizontalS },
  freshCount: { color: tokens.colorBrandForeground1, fontWeight: tokens.fontWeightSemibold },
  list: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM, margin: 0, padding: 0 },
  item: { listStyleType: 'none' },
  status: { color: tokens.colorNeutralForeground2 },
  statusError: { color: tokens.colorPaletteRedForeground1 },
  empty: { padding: tokens.spacingHorizontalXL, color: tokens.colorNeutralForeground2 },
  group: {
    padding: `${tokens.spacingVerticalL} ${tokens.spacingHorizontalXL}`,
    gap: tokens.spacingVerticalS,
  },
  groupHead: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', gap: tokens.spacingHorizontalM },
  groupRo: { fontSize: tokens.fontSizeBase500, fontWeight: tokens.fontWeightSemibold },
  spacer: { flexGrow: 1 },
  answered: {
    display: 'grid',
    gridTemplateColumns: 'minmax(0, 1fr) auto',
    gap: tokens.spacingHorizontalXL,
    padding: `${tokens.spacingVerticalS} 0`,
    ...shorthands.borderTop(tokens.strokeWidthThin, 'solid', tokens.colorNeutralStroke2),
  },
  answeredText: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXXS, minWidth: 0 },
  answeredHead: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', gap: tokens.spacingHorizontalS },
  dim: { color: tokens.colorNeutralForeground3 },
  live: { position: 'absolute', width: '1px', height: '1px', overflow: 'hidden', clipPath: 'inset(50%)' },
});

function useWhen(timeZone: string | undefined) {
  return useCallback((iso: string) => dayClockTime(iso, timeZone), [timeZone]);
}

function answerSummary(result: FindingAnswerResult): string {
  const { finding, createdLine, resumedLine } = result;
  const head =
    finding.answer === 'approved' && createdLine
      ? `${FINDING_ANSWER_WORDS.approved}: ${lineWords(createdLine.lineNo)} “${createdLine.title}” (${formatBookHours(createdLine.bookHours)}) added to RO ${finding.repairOrderNumber}, waiting in the queue.`
      : `${FINDING_ANSWER_WORDS.declined}: noted on RO ${finding.repairOrderNumber}.`;
  return resumedLine ? `${head} Line ${resumedLine.lineNo} is no longer held and can carry on.` : head;
}

function AnsweredGroupCard({
  group,
  formatWhen,
  onChange,
}: {
  group: AnsweredGroup;
  onChange: (finding: FindingDto) => void;
  formatWhen: (iso: string) => string;
}) {
  const styles = useStyles();
  return (
    <Card className={styles.group}>
      <div className={styles.groupHead}>
        <span className={styles.groupRo}>RO {group.repairOrderNumber}</span>
        <Text>{group.vehicle}</Text>
        <Text className={styles.dim}>· {group.customerName}</Text>
        <span className={styles.spacer} />
        {/* The ready notice goes from the RO page, once the work is done. */}
        <RouterLink to={paths.repairOrder(group.repairOrderId)}>Open RO {group.repairOrderNumber}</RouterLink>
      </div>
      {group.findings.map((finding) => (
        <div key={finding.id} className={styles.answered}>
          <div className={styles.answeredText}>
            <div className={styles.answeredHead}>
              <Badge appearance="filled" color={finding.answer === 'approved' ? 'brand' : 'informative'}>
                {FINDING_ANSWER_WORDS[finding.answer]}
              </Badge>
              <SeverityBadge severity={finding.severity} />
              <Text>
                Line {finding.lineNo} · {finding.lineTitle}
              </Text>
            </div>
            <Body1>{finding.customerWording ?? finding.note}</Body1>
            <Caption1 className={styles.status}>
              {answeredText(finding)}
              {finding.answeredAt && `, ${formatWhen(finding.answeredAt)}`}
              {finding.answer === 'approved' && finding.createdLineId !== null && ': a new line was added'}
              {finding.answer === 'declined' && finding.answerNote && `: “${finding.answerNote}”`}
              {' · found by '}
              {finding.technicianName}
            </Caption1>
            <div>
              <Button size="small" onClick={() => onChange(finding)}>
                Change answer…
              </Button>
            </div>
          </div>
          <FindingPhotos
            photos={finding.photos}
            title={`RO ${finding.repairOrderNumber}, line ${finding.lineNo}`}
            small
          />
        </div>
      ))}
    </Card>
  );
}

/** The office's findings: pending ones to answer, live; answered ones by repair order. */
export function FindingsInbox({
  role,
  tab,
  onTab,
  timeZone,
  labourRateCents,
}: {
  role: InboxRole;
  tab: InboxTab;
  onTab: (tab: InboxTab) => void;
  timeZone: string | undefined;
  labourRateCents: number | undefined;
}) {
  const styles = useStyles();
  const now = useMinuteNow();
  const formatWhen = useWhen(timeZone);
  const pending = useFindings('pending');
  const approved = useFindings('approved', tab === 'answered');
  const declined = useFindings('declined', tab === 'answered');
  const request = useRequestApproval();
  const revoke = useRevokeApprovalLink();
  const mayAsk = role === 'advisor' || role === 'owner';
  const [requestResults, setRequestResults] = useState<Record<number, { ok: boolean; text: string }>>({});
  const fresh = useSyncExternalStore(findingArrivals.subscribe, findingArrivals.get);
  const [dialog, setDialog] = useState<{
    kind: 'quote' | 'approve' | 'decline' | 'change';
    finding: FindingDto;
  } | null>(null);
  const [done, setDone] = useState<string | null>(null);

  // Marked new while the inbox is open; once it is left they count as seen.
  useEffect(() => findingArrivals.clear, []);

  const sorted = useMemo(() => sortPending(pending.data?.items ?? []), [pending.data]);
  const groups = useMemo(
    () => groupAnswered([...(approved.data?.items ?? []), ...(declined.data?.items ?? [])]),
    [approved.data, declined.data],
  );
  const answeredNotShown =
    (approved.data ? approved.data.total - approved.data.items.length : 0) +
    (declined.data ? declined.data.total - declined.data.items.length : 0);
  const freshPending = sorted.filter((finding) => fresh.has(finding.id)).length;

  const askCustomer = (finding: FindingDto) =>
    request.mutate(finding.id, {
      onSuccess: (sent) =>
        setRequestResults((current) => ({
          ...current,
          ...Object.fromEntries(
            sent.findingIds.map((id) => [
              id,
              {
                ok: true,
                text:
                  `Approval link sent ${sentToWords(sent.mail?.to, sent.text?.to)}` +
                  (sent.findingIds.length > 1
                    ? `, with ${sent.findingIds.length} findings of this RO.`
                    : '.'),
              },
            ]),
          ),
        })),
      onError: (error) =>
        setRequestResults((current) => ({
          ...current,
          [finding.id]: { ok: false, text: formErrorText(error) },
        })),
    });

  const finish = (result: FindingAnswerResult) => {
    setDialog(null);
    setDone(answerSummary(result));
    findingArrivals.seen(result.finding.id);
  };

  const statusOf = (finding: FindingDto) => {
    const result = requestResults[finding.id];
    if (result)
      return (
        <Caption1
          className={result.ok ? styles.status : styles.statusError}
          role={result.ok ? 'status' : 'alert'}
        >
          {result.text}
        </Caption1>
      );
    if (finding.approvalLink)
      return (
        <Caption1 className={styles.status}>
          {linkStateText(finding.approvalLink, formatWhen)}{' '}
          {mayAsk && finding.approvalLink.status === 'active' && (
            <Button
              size="small"
              appearance="transparent"
              disabled={revoke.isPending}
              onClick={() => revoke.mutate(finding.approvalLink!.id)}
            >
              Withdraw the link
            </Button>
          )}
        </Caption1>
      );
    if (!finding.customerHasEmail && !finding.customerHasMobile && mayAsk)
      return (
        <Caption1 className={styles.dim}>
          No e-mail or mobile number on file for this customer: ask by phone.
        </Caption1>
      );
    return null;
  };

  const answeredPending = approved.isPending || declined.isPending;
  const answeredError = approved.error ?? declined.error;

  return (
    <div className={styles.page}>
      <div className={styles.live} aria-live="polite">
        {freshPending > 0 ? `${freshPending} new finding${freshPending === 1 ? '' : 's'}` : ''}
      </div>
      <div className={styles.bar}>
        <TabList
          selectedValue={tab}
          onTabSelect={(_, data) => onTab(data.value as InboxTab)}
          aria-label="Findings"
        >
          <Tab value="pending">
            Waiting for an answer
            {pending.data && (
              <CounterBadge
                className={styles.tabCount}
                count={pending.data.total}
                showZero
                appearance="filled"
                color={pending.data.total > 0 ? 'brand' : 'informative'}
              />
            )}
            {freshPending > 0 && <span className={styles.freshCount}> · {freshPending} new</span>}
          </Tab>
          <Tab value="answered">Answered</Tab>
        </TabList>
      </div>
      {done && (
        <MessageBar intent="success" layout="singleline">
          <MessageBarBody>{done}</MessageBarBody>
          <MessageBarActions>
            <Button size="small" appearance="transparent" onClick={() => setDone(null)}>
              Dismiss
            </Button>
          </MessageBarActions>
        </MessageBar>
      )}

      {tab === 'pending' ? (
        pending.isPending ? (
          <Spinner label="Loading findings…" />
        ) : pending.isError ? (
          <MessageBar intent="error">
            <MessageBarBody>{formErrorText(pending.error)}</MessageBarBody>
          </MessageBar>
        ) : sorted.length === 0 ? (
          <Card className={styles.empty}>
            <Subtitle2 as="h2">Nothing waiting</Subtitle2>
            <Body1>New findings from the technicians appear here as they are made.</Body1>
          </Card>
        ) : (
          <ul className={styles.list} aria-label="Findings waiting for an answer">
            {sorted.map((finding) => (
              <li key={finding.id} className={styles.item}>
                <FindingCard
                  finding={finding}
                  isNew={fresh.has(finding.id)}
                  now={now}
                  formatWhen={formatWhen}
                  status={statusOf(finding)}
                  actions={
                    <>
                      {mayAsk && (
                        <>
                          <Button onClick={() => setDialog({ kind: 'quote', finding })}>
                            {finding.customerWording === null
                              ? 'Review for the customer…'
                              : 'Edit wording and price…'}
                          </Button>
                          <Button
                            disabled={
                              finding.customerWording === null ||
                              (!finding.customerHasEmail && !finding.customerHasMobile) ||
                              (request.isPending && request.variables === finding.id)
                            }
                            onClick={() => askCustomer(finding)}
                          >
                            {request.isPending && request.variables === finding.id
                              ? 'Sending…'
                              : finding.approvalLink
                                ? 'Send a new approval link'
                                : 'Send approval link'}
                          </Button>
                        </>
                      )}
                      <Button appearance="primary" onClick={() => setDialog({ kind: 'approve', finding })}>
                        Customer approved…
                      </Button>
                      <Button onClick={() => setDialog({ kind: 'decline', finding })}>
                        Customer declined…
                      </Button>
                    </>
                  }
                />
              </li>
            ))}
          </ul>
        )
      ) : answeredPending ? (
        <Spinner label="Loading answered findings…" />
      ) : answeredError ? (
        <MessageBar intent="error">
          <MessageBarBody>{formErrorText(answeredError)}</MessageBarBody>
        </MessageBar>
      ) : groups.length === 0 ? (
        <Card className={styles.empty}>
          <Body1>No answered findings yet.</Body1>
        </Card>
      ) : (
        <div className={styles.list}>
          {groups.map((group) => (
            <AnsweredGroupCard
              key={group.repairOrderId}
              group={group}
              formatWhen={formatWhen}
              onChange={(finding) => setDialog({ kind: 'change', finding })}
            />
          ))}
          {answeredNotShown > 0 && (
            <Caption1 className={styles.dim}>
              The latest answers are shown; {answeredNotShown.toLocaleString('en-US')} older ones are on their
              repair orders.
            </Caption1>
          )}
        </div>
      )}

      {dialog?.kind === 'quote' && (
        <QuoteDialog
          finding={dialog.finding}
          labourRateCents={labourRateCents}
          onClose={() => setDialog(null)}
        />
      )}
      {dialog?.kind === 'approve' && (
        <ApproveDialog finding={dialog.finding} onClose={() => setDialog(null)} onDone={finish} />
      )}
      {dialog?.kind === 'change' && (
        <ChangeAnswerDialog finding={dialog.finding} onClose={() => setDialog(null)} onDone={finish} />
      )}
      {dialog?.kind === 'decline' && (
        <DeclineDialog finding={dialog.finding} onClose={() => setDialog(null)} onDone={finish} />
      )}
    </div>
  );
}
