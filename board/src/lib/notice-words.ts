import { formatPhone, type NoticesQueued } from '@baytime/shared';

/** Where a notice went: "by e-mail to a@b.test and by text to (608) 555-0177". */
export function sentToText(queued: NoticesQueued): string {
  const ways = [
    queued.mail && `by e-mail to ${queued.mail.to}`,
    queued.text && `by text to ${formatPhone(queued.text.to)}`,
  ].filter(Boolean);
  return ways.length ? ways.join(' and ') : 'nowhere';
}
