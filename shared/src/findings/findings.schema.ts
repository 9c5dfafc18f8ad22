/** How soon a finding needs the customer's attention. */
export const FINDING_SEVERITIES = ['safety-now', 'soon', 'watch'] as const;
export type FindingSeverity = (typeof FINDING_SEVERITIES)[number];

export const FINDING_ANSWERS = ['pending', 'approved', 'declined'] as const;
export type FindingAnswer = (typeof FINDING_ANSWERS)[number];
