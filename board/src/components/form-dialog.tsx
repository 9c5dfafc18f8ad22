import type { ReactNode } from 'react';
import {
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
  surface: { maxWidth: '36rem' },
  content: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
});

export interface FormDialogProps {
  title: string;
  submitLabel: string;
  /** The save button's words while the answer is on its way. */
  pendingLabel?: string;
  cancelLabel?: string;
  pending: boolean;
  /** The form's own message: a refusal no single field owns. */
  formError: string | undefined;
  onSubmit: () => void;
  onClose: () => void;
  children: ReactNode;
}

/** A dialog around one react-hook-form form: fields, the form's message, Cancel and the save button. */
export function FormDialog({
  title,
  submitLabel,
  pendingLabel = 'Saving…',
  cancelLabel = 'Cancel',
  pending,
  formError,
  onSubmit,
  onClose,
  children,
}: FormDialogProps) {
  const styles = useStyles();
  return (
    <Dialog open onOpenChange={(_, data) => !data.open && onClose()}>
      <DialogSurface className={styles.surface}>
        <form
          noValidate
          aria-label={title}
          onSubmit={(event) => {
            event.preventDefault();
            onSubmit();
          }}
        >
          <DialogBody>
            <DialogTitle>{title}</DialogTitle>
            <DialogContent className={styles.content}>
              {children}
              <FormErrorBar message={formError ?? null} />
            </DialogContent>
            <DialogActions>
              <Button appearance="secondary" onClick={onClose}>
                {cancelLabel}
              </Button>
              <Button appearance="primary" type="submit" disabled={pending}>
                {pending ? pendingLabel : submitLabel}
              </Button>
            </DialogActions>
          </DialogBody>
        </form>
      </DialogSurface>
    </Dialog>
  );
}
