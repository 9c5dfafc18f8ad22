import { Badge, Body1, Caption1, makeStyles, tokens } from '@fluentui/react-components';
import {
  FINDING_ANSWER_WORDS,
  FINDING_SEVERITY_LABELS,
  ANSWER_CHANNEL_WORDS,
  type FindingAnswer,
  type FindingDto,
  type FindingSeverity,
} from '@baytime/shared';
import { formatBookHours, formatDateTime, lineLabel } from '../ro-format';
import { FindingPhoto } from './finding-photo';

const useStyles = makeStyles({
  card: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalS,
    padding: tokens.spacingHorizontalM,
    borderRadius: tokens.borderRadiusMedium,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    backgroundColor: tokens.colorNeutralBackground1,
  },
  head: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', gap: tokens.spacingHorizontalS },
  line: { fontWeight: tokens.fontWeightSemibold, marginRight: 'auto' },
  note: { whiteSpace: 'pre-wrap' },
  dim: { color: tokens.colorNeutralForeground3 },
  photos: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS },
});

const SEVERITY: Record<FindingSeverity, { label: string; color: 'danger' | 'important' | 'informative' }> = {
  'safety-now': { label: FINDING_SEVERITY_LABELS['safety-now'], color: 'danger' },
  soon: { label: FINDING_SEVERITY_LABELS.soon, color: 'important' },
  watch: { label: FINDING_SEVERITY_LABELS.watch, color: 'informative' },
};

const ANSWER: Record<FindingAnswer, { label: string; color: 'informative' | 'brand' | 'subtle' }> = {
  pending: { label: FINDING_ANSWER_WORDS.pending, color: 'informative' },
  approved: { label: FINDING_ANSWER_WORDS.approved, color: 'brand' },
  declined: { label: FINDING_ANSWER_WORDS.declined, color: 'subtle' },
};

export function FindingCard({ finding, timeZone }: { finding: FindingDto; timeZone: string | undefined }) {
  const styles = useStyles();
  const severity = SEVERITY[finding.severity];
  const answer = ANSWER[finding.answer];
  return (
    <article className={styles.card} aria-label={`Finding on line ${finding.lineNo}`}>
      <div className={styles.head}>
        <Body1 className={styles.line}>
          {lineLabel({ lineNo: finding.lineNo, title: finding.lineTitle })}
        </Body1>
        <Badge appearance="filled" color={severity.color}>
          {severity.label}
        </Badge>
        <Badge appearance="tint" color={answer.color}>
          {answer.label}
        </Badge>
      </div>
      <Body1 className={styles.note}>{finding.note}</Body1>
      <Caption1 className={styles.dim}>
        {finding.technicianName}, {formatDateTime(finding.createdAt, timeZone)}
        {finding.suggestedHours !== null && ` · suggests ${formatBookHours(finding.suggestedHours)}`}
        {finding.approvalRequestedAt &&
          ` · approval asked ${formatDateTime(finding.approvalRequestedAt, timeZone)}`}
      </Caption1>
      {finding.answer !== 'pending' && (
        <Caption1>
          <strong>{answer.label}</strong>
          {finding.answeredBy && ` by ${finding.answeredBy}`}
          {finding.answerChannel && ` ${ANSWER_CHANNEL_WORDS[finding.answerChannel]}`}
          {finding.answeredAt && `, ${formatDateTime(finding.answeredAt, timeZone)}`}
          {finding.answerNote && `: “${finding.answerNote}”`}
          {finding.createdLineId !== null && ' · added as a new job line'}
        </Caption1>
      )}
      {finding.photos.length > 0 && (
        <div className={styles.photos}>
          {finding.photos.map((photo, index) => (
            <FindingPhoto
              key={photo.id}
              photo={photo}
              alt={`Photo ${index + 1} of the finding on line ${finding.lineNo}`}
            />
          ))}
        </div>
      )}
    </article>
  );
}
