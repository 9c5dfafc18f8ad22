import { useState, type FormEvent, type ReactNode } from 'react';
import {
  Button,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  Field,
  Textarea,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { FormErrorBar } from './form-error-bar';

const useStyles = makeStyles({
  content: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
});

/**
 * A decision that needs a reason on record (reopen a week, accept a punch, sign off a line). Keep it mounted
 * and drive `open`: a modal dialog unmounted while open leaves the rest of the page hidden from assistive
 * technology (aria-hidden on the app root).
 */
export function ReasonDialog({
  open,
  title,
  children,
  label = 'Reason',
  hint = 'Kept on record with your name and the time.',
  confirm,
  pending,
  error,
  onConfirm,
  onClose,
}: {
  open: boolean;
  title: string;
  children?: ReactNode;
  label?: string;
  hint?: string;
  confirm: string;
  pending: boolean;
  error: string | null;
  onConfirm: (reason: string) => void;
  onClose: () => void;
}) {
  const styles = useStyles();
  const [reason, setReason] = useState('');
  const [missing, setMissing] = useState(false);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (reason.trim().length < 3) return setMissing(true);
    onConfirm(reason.trim());
  };
  return (
    <Dialog open={open} onOpenChange={(_, data) => !data.open && onClose()} modalType="modal">
      <DialogSurface>
        <form onSubmit={submit} noValidate>
          <DialogBody>
            <DialogTitle>{title}</DialogTitle>
            <DialogContent className={styles.content}>
              {children}
              <Field
                label={label}
                required
                hint={hint}
                validationMessage={missing ? 'Say why, in a few words' : undefined}
              >
                <Textarea
                  value={reason}
                  maxLength={500}
                  resize="vertical"
                  onChange={(_, data) => {
                    setReason(data.value);
                    setMissing(false);
                  }}
                />
              </Field>
              <FormErrorBar message={error} />
            </DialogContent>
            <DialogActions>
              <Button type="button" onClick={onClose}>
                Cancel
              </Button>
              <Button appearance="primary" type="submit" disabled={pending}>
                {pending ? 'Saving…' : confirm}
              </Button>
            </DialogActions>
          </DialogBody>
        </form>
      </DialogSurface>
    </Dialog>
  );
}
