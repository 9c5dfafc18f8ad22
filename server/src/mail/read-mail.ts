import type { AddressObject, EmailAddress } from 'mailparser';

/** What the local mailbox shows of a message it received. */
export interface ReadMail {
  from: string;
  to: string[];
  subject: string;
  text: string;
  attachments: { filename: string; contentType: string; sizeBytes: number }[];
}

/** `Name <address>`, the name quoted when RFC 5322 needs it (a comma, a dot, brackets…). */
const display = ({ name, address = '' }: EmailAddress): string =>
  name
    ? `${/[()<>[\]:;@\\,."]/.test(name) ? `"${name.replaceAll('"', '\\"')}"` : name} <${address}>`
    : address;

const addresses = (field: AddressObject | AddressObject[] | undefined): string[] =>
  (Array.isArray(field) ? field : field ? [field] : []).flatMap((group) => group.value).map(display);

/**
 * Reads a raw message with mailparser, loaded with the first message rather than at start-up; a message
 * with HTML only shows its text.
 */
export async function readMail(raw: Buffer): Promise<ReadMail> {
  const { simpleParser } = await import('mailparser');
  const mail = await simpleParser(raw, { skipImageLinks: true, skipTextLinks: true });
  return {
    from: addresses(mail.from)[0] ?? '',
    to: [...addresses(mail.to), ...addresses(mail.cc)],
    subject: mail.subject ?? '',
    text: mail.text ?? '',
    attachments: mail.attachments.map((attachment) => ({
      filename: attachment.filename ?? 'attachment',
      contentType: attachment.contentType,
      sizeBytes: attachment.size,
    })),
  };
}
