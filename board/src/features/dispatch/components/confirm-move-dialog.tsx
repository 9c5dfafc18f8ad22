import {
  Body1,
  Button,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { repairOrderLineWords } from '@baytime/shared';
import { confirmQuestion, type MovePlan } from '../dispatch-model';

const useStyles = makeStyles({
  content: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
  warn: { color: tokens.colorStatusWarningForeground1, fontWeight: tokens.fontWeightSemibold },
  action: { whiteSpace: 'nowrap' },
});

export function ConfirmMoveDialog({
  plan,
  onConfirm,
  onCancel,
}: {
  plan: MovePlan | null;
  onConfirm: (plan: MovePlan) => void;
  onCancel: () => void;
}) {
  const styles = useStyles();
  const question = plan ? confirmQuestion(plan) : null;
  return (
    <Dialog open={plan !== null} onOpenChange={(_, data) => !data.open && onCancel()} modalType="alert">
      <DialogSurface>
        {plan && question && (
          <DialogBody>
            <DialogTitle>{question.title}</DialogTitle>
            <DialogContent className={styles.content}>
              <Body1>
                <strong>{repairOrderLineWords(plan.line.repairOrderNumber, plan.line.lineNo)}</strong>{' '}
                {plan.line.title}
              </Body1>
              <Body1>{question.text}</Body1>
              {plan.skillWarning && <Body1 className={styles.warn}>{plan.skillWarning}.</Body1>}
            </DialogContent>
            <DialogActions>
              <Button appearance="primary" className={styles.action} onClick={() => onConfirm(plan)}>
                {question.action}
              </Button>
              <Button className={styles.action} onClick={onCancel}>
                Keep it as it is
              </Button>
            </DialogActions>
          </DialogBody>
        )}
      </DialogSurface>
    </Dialog>
  );
}
