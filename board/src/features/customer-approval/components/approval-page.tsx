import { useState, type FormEvent } from 'react';
import {
  Button,
  Card,
  Field,
  Input,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Radio,
  RadioGroup,
  Spinner,
  Subtitle1,
  Text,
  Title2,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import {
  formatCents,
  formatPhone,
  publicApprovalAnswerSchema,
  type PublicApproval,
  type PublicApprovalFinding,
  type PublicApprovalResult,
} from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { useApproval } from '../api/get-approval';
import { useSendAnswer } from '../api/send-answer';
import { hoursText, shopTimeText, unavailableText } from '../approval-words';

type Choice = 'approved' | 'declined';

const useStyles = makeStyles({
  page: {
    maxWidth: '40rem',
    margin: '0 auto',
    padding: `${tokens.spacingVerticalXL} ${tokens.spacingHorizontalL}`,
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalL,
    boxSizing: 'border-box',
  },
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  head: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXS },
  dim: { color: tokens.colorNeutralForeground2 },
  call: { fontSize: tokens.fontSizeBase400, fontWeight: tokens.fontWeightSemibold },
  list: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL, margin: 0, padding: 0 },
  item: { listStyleType: 'none' },
  card: { padding: tokens.spacingHorizontalL, gap: tokens.spacingVerticalM },
  wording: { fontSize: tokens.fontSizeBase400, lineHeight: tokens.lineHeightBase400 },
  photos: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS, margin: 0, padding: 0 },
  photo: { listStyleType: 'none' },
  thumb: {
    display: 'block',
    width: '9rem',
    height: '6.75rem',
    objectFit: 'cover',
    borderRadius: tokens.borderRadiusMedium,
    backgroundColor: tokens.colorNeutralBackground3,
  },
  price: {
    display: 'grid',
    gridTemplateColumns: 'minmax(0, 1fr) auto',
    gap: `${tokens.spacingVerticalXXS} ${tokens.spacingHorizontalM}`,
    margin: 0,
    fontVariantNumeric: 'tabular-nums',
  },
  amount: { margin: 0, textAlign: 'right' },
  strong: { fontWeight: tokens.fontWeightSemibold },
  choice: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalL },
  total: { padding: tokens.spacingHorizontalL, gap: tokens.spacingVerticalS },
  submit: { minHeight: '3rem', fontSize: tokens.fontSizeBase400 },
});

function PriceLines({
  finding,
  labourRateCents,
}: {
  finding: PublicApprovalFinding;
  labourRateCents: number;
}) {
  const styles = useStyles();
  return (
    <dl className={styles.price}>
      <dt>
        Labour: {hoursText(finding.bookHours)} × {formatCents(labourRateCents)} an hour
      </dt>
      <dd className={styles.amount}>{formatCents(finding.labourCents)}</dd>
      <dt>Parts</dt>
      <dd className={styles.amount}>{formatCents(finding.partsCents)}</dd>
      <dt className={styles.strong}>Estimated price</dt>
      <dd className={`${styles.amount} ${styles.strong}`}>{formatCents(finding.priceCents)}</dd>
    </dl>
  );
}

function FindingItem({
  finding,
  index,
  count,
  labourRateCents,
  choice,
  error,
  onChoose,
}: {
  finding: PublicApprovalFinding;
  index: number;
  count: number;
  labourRateCents: number;
  choice: Choice | undefined;
  error: string | undefined;
  onChoose: (choice: Choice) => void;
}) {
  const styles = useStyles();
  const titleId = `finding-${finding.id}`;
  return (
    <Card className={styles.card} aria-labelledby={titleId}>
      <Subtitle1 as="h2" id={titleId}>
        Item {index + 1} of {count}
      </Subtitle1>
      <Text className={styles.wording}>{finding.wording}</Text>
      <Text className={styles.dim}>{finding.severityWords}.</Text>
      {finding.photos.length > 0 && (
        <ul className={styles.photos} aria-label={`Photos of item ${index + 1}`}>
          {finding.photos.map((photo, n) => (
            <li key={photo.url} className={styles.photo}>
              <a href={photo.url} target="_blank" rel="noreferrer">
                <img
                  className={styles.thumb}
                  src={photo.previewUrl}
                  alt={`Photo ${n + 1} of item ${index + 1}, opens full size`}
                />
              </a>
            </li>
          ))}
        </ul>
      )}
      <PriceLines finding={finding} labourRateCents={labourRateCents} />
      <Field label={`Your answer for item ${index + 1}`} required validationMessage={error}>
        <RadioGroup
          className={styles.choice}
          layout="horizontal"
          value={choice ?? ''}
          onChange={(_, data) => onChoose(data.value as Choice)}
        >
          <Radio value="approved" label="Approve" />
          <Radio value="declined" label="Decline" />
        </RadioGroup>
      </Field>
    </Card>
  );
}

function ApprovalForm({
  token,
  approval,
  onDone,
}: {
  token: string;
  approval: PublicApproval;
  onDone: (result: PublicApprovalResult) => void;
}) {
  const styles = useStyles();
  const send = useSendAnswer();
  const [choices, setChoices] = useState<Record<number, Choice>>({});
  const [name, setName] = useState('');
  const [errors, setErrors] = useState<Record<string, string | undefined>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const approvedCents = approval.findings
    .filter((finding) => choices[finding.id] === 'approved')
    .reduce((sum, finding) => sum + finding.priceCents, 0);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    const missing = Object.fromEntries(
      approval.findings
        .filter((finding) => !choices[finding.id])
        .map((finding) => [`finding-${finding.id}`, 'Choose approve or decline']),
    );
    const parsed = publicApprovalAnswerSchema.safeParse({
      answers: approval.findings
        .filter((finding) => choices[finding.id])
        .map((finding) => ({ findingId: finding.id, answer: choices[finding.id] })),
      signedName: name,
    });
    const nameError = parsed.success
      ? undefined
      : parsed.error.issues.find((issue) => issue.path[0] === 'signedName')?.message;
    if (Object.keys(missing).length || nameError || !parsed.success)
      return setErrors({ ...missing, signedName: nameError });
    send.mutate(
      { token, body: parsed.data },
      {
        onSuccess: onDone,
        onError: (error) =>
          setFormError(
            error instanceof ApiError && error.status >= 400 && error.status < 500
              ? error.message
              : unavailableText(error).text,
          ),
      },
    );
  };

  return (
    <form className={styles.form} onSubmit={submit} noValidate>
      <Text>
        While working on your vehicle our technician found{' '}
        {approval.findings.length === 1 ? 'something' : 'a few things'} we would like your decision on.
        Approve or decline each item, type your name, and send your answer. We do no extra work without your
        approval.
      </Text>
      <ul className={styles.list}>
        {approval.findings.map((finding, index) => (
          <li key={finding.id} className={styles.item}>
            <FindingItem
              finding={finding}
              index={index}
              count={approval.findings.length}
              labourRateCents={approval.labourRateCents}
              choice={choices[finding.id]}
              error={errors[`finding-${finding.id}`]}
              onChoose={(choice) => {
                setChoices((current) => ({ ...current, [finding.id]: choice }));
                setErrors((current) => ({ ...current, [`finding-${finding.id}`]: undefined }));
              }}
            />
          </li>
        ))}
      </ul>
      <Card className={styles.total}>
        <dl className={styles.price}>
          <dt>Total if you approve everything</dt>
          <dd className={styles.amount}>{formatCents(approval.totalCents)}</dd>
          <dt className={styles.strong}>Total of what you approve</dt>
          <dd className={`${styles.amount} ${styles.strong}`} aria-live="polite">
            {formatCents(approvedCents)}
          </dd>
        </dl>
        <Text className={styles.dim}>
          These prices are estimates: the final bill can differ a little, and we will ask you again before
          doing anything more than you approve here.{approval.taxNote ? ` ${approval.taxNote}` : ''}
        </Text>
      </Card>
      <Field
        label="Type your full name to sign"
        required
        validationMessage={errors.signedName}
        hint="Your name, the time and this device are kept with your answer."
      >
        <Input
          value={name}
          maxLength={80}
          autoComplete="name"
          onChange={(_, data) => {
            setName(data.value);
            setErrors((current) => ({ ...current, signedName: undefined }));
          }}
        />
      </Field>
      {formError && (
        <MessageBar intent="error" layout="multiline">
          <MessageBarBody>{formError}</MessageBarBody>
        </MessageBar>
      )}
      <Button className={styles.submit} appearance="primary" type="submit" disabled={send.isPending}>
        {send.isPending ? 'Sending…' : 'Send my answer'}
      </Button>
      <Text className={styles.dim}>
        {`This link works until ${shopTimeText(approval.expiresAt, approval.shop.timeZone)}. You can answer once.`}
      </Text>
    </form>
  );
}

function Thanks({ approval, result }: { approval: PublicApproval; result: PublicApprovalResult }) {
  const approved = result.answers.filter((answer) => answer.answer === 'approved').length;
  const declined = result.answers.length - approved;
  return (
    <div role="status">
      <MessageBar intent="success" layout="multiline">
        <MessageBarBody>
          <MessageBarTitle>Thank you, {result.signedName}</MessageBarTitle>
          We have your answer: {approved} approved ({formatCents(result.approvedCents)}, estimate) and{' '}
          {declined} declined. {approval.shop.name} will carry on with what you approved.
        </MessageBarBody>
      </MessageBar>
    </div>
  );
}

/** The page a customer opens from the approval message, on their phone, without signing in. */
export function ApprovalPage({ token }: { token: string }) {
  const styles = useStyles();
  const approval = useApproval(token);
  const [result, setResult] = useState<PublicApprovalResult | null>(null);

  if (approval.isPending)
    return (
      <main className={styles.page}>
        <Spinner label="Opening your approval request…" />
      </main>
    );
  if (approval.isError) {
    const { title, text } = unavailableText(approval.error);
    return (
      <main className={styles.page}>
        <MessageBar intent="warning" layout="multiline">
          <MessageBarBody>
            <MessageBarTitle>{title}</MessageBarTitle>
            {text}
          </MessageBarBody>
        </MessageBar>
      </main>
    );
  }
  const data = approval.data;
  return (
    <main className={styles.page}>
      <header>
        <div className={styles.head}>
          <Title2 as="h1">{data.shop.name}</Title2>
          {data.shop.phone && (
            <a className={styles.call} href={`tel:${data.shop.phone}`}>
              Call us: {formatPhone(data.shop.phone)}
            </a>
          )}
          <Text className={styles.dim}>
            Your {data.vehicle}, repair order {data.repairOrderNumber}
          </Text>
        </div>
      </header>
      {result ? (
        <Thanks approval={data} result={result} />
      ) : (
        <ApprovalForm token={token} approval={data} onDone={setResult} />
      )}
    </main>
  );
}
