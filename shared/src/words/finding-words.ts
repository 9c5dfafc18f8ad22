import type { FindingAnswer, FindingSeverity } from '../findings/findings.schema.js';

/** A finding's severity on every screen of the shop, beside its icon (`FINDING_SEVERITY_ICONS`). */
export const FINDING_SEVERITY_LABELS: Readonly<Record<FindingSeverity, string>> = {
  'safety-now': 'Safety: fix now',
  soon: 'Fix soon',
  watch: 'Watch',
};

/** The same severities as sentences, only for the customer: e-mails, texts and the approval page. */
export const FINDING_SEVERITY_FOR_CUSTOMERS: Readonly<Record<FindingSeverity, string>> = {
  'safety-now': 'A safety concern: we advise fixing it before the vehicle is driven again',
  soon: 'Should be fixed soon',
  watch: 'Not urgent: worth keeping an eye on at your next visits',
};

/** The customer's answer to a finding, as the shop reads it. */
export const FINDING_ANSWER_WORDS: Readonly<Record<FindingAnswer, string>> = {
  pending: 'Waiting for the customer',
  approved: 'Approved',
  declined: 'Declined',
};
