import { MessageBar, MessageBarBody } from '@fluentui/react-components';

/** The one message for a save that failed for a reason no single field owns. */
export function FormErrorBar({ message }: { message: string | null }) {
  if (!message) return null;
  return (
    <MessageBar intent="error">
      <MessageBarBody>{message}</MessageBarBody>
    </MessageBar>
  );
}
