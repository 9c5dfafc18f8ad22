import { formatPhone } from '../input/phone.js';

/** Where a notice went: "by e-mail to a@b.test and by text to (608) 555-0177". */
export function sentToWords(email: string | null | undefined, mobile: string | null | undefined): string {
  const ways = [email && `by e-mail to ${email}`, mobile && `by text to ${formatPhone(mobile)}`].filter(
    Boolean,
  );
  return ways.length ? ways.join(' and ') : 'nowhere';
}
