import type { ReactNode } from 'react';
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
import { FormErrorBar } from './form-error-bar';

const useStyles = makeStyles({
  content: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
});

export interface ConfirmDialogProps {
  title: string;
  /** What the step does and what it cannot take back, read before saying yes. */
  children: ReactNode;
  confirmLabel: string;
  pendingLabel: string;
  keepLabel?: string;
  pending: boolean;
  /** Why the last try was refused. */
  error: string | null;
  onConfirm: () => void;
  onClose: () => void;
}

/** A yes-or-no question before a step that cannot be undone. */
export function ConfirmDialog({
  title,
  children,
  confirmLabel,
  pendingLabel,
  keepLabel = 'Keep it',
  pending,
  error,
  onConfirm,
  onClose,
}: ConfirmDialogProps) {
  const styles = useStyles();
  return (
    <Dialog open onOpenChange={(_, data) => !data.open && onClose()}>
      <DialogSurface>
        <DialogBody>
          <DialogTitle>{title}</DialogTitle>
          <DialogContent className={styles.content}>
            <Body1>{children}</Body1>
            <FormErrorBar message={error} />
          </DialogContent>
          <DialogActions>
            <Button onClick={onClose}>{keepLabel}</Button>
            <Button appearance="primary" disabled={pending} onClick={onConfirm}>
              {pending ? pendingLabel : confirmLabel}
            </Button>
          </DialogActions>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}
