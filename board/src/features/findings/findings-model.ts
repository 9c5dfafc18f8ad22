import {
  FINDING_ANSWER_WORDS,
  ANSWER_CHANNEL_WORDS,
  formatPhone,
  type ApprovalLinkDto,
  type FindingDto,
  type FindingSeverity,
} from '@baytime/shared';

const SEVERITY_RANK: Record<FindingSeverity, number> = { 'safety-now': 0, soon: 1, watch: 2 };

/** Safety first, then the one waiting longest. */
export function sortPending(findings: readonly FindingDto[]): FindingDto[] {
  return [...findings].sort(
    (a, b) =>
      SEVERITY_RANK[a.severity] - SEVERITY_RANK[b.severity] ||
      Date.parse(a.createdAt) - Date.parse(b.createdAt) ||
      a.id - b.id,
  );
}

export interface AnsweredGroup {
  repairOrderId: number;
  repairOrderNumber: string;
  vehicle: string;
  customerName: string;
  findings: FindingDto[];
  lastAnsweredAt: string;
}

/** Answered findings by repair order, the most recently answered order first. */
export function groupAnswered(findings: readonly FindingDto[]): AnsweredGroup[] {
  const groups = new Map<number, AnsweredGroup>();
  const answeredAt = (finding: FindingDto) => finding.answeredAt ?? finding.createdAt;
  for (const finding of [...findings].sort((a, b) => Date.parse(answeredAt(b)) - Date.parse(answeredAt(a)))) {
    const group = groups.get(finding.repairOrderId);
    if (group) group.findings.push(finding);
    else
      groups.set(finding.repairOrderId, {
        repairOrderId: finding.repairOrderId,
        repairOrderNumber: finding.repairOrderNumber,
        vehicle: finding.vehicle,
        customerName: finding.customerName,
        findings: [finding],
        lastAnsweredAt: answeredAt(finding),
      });
  }
  return [...groups.values()];
}

/** Book hours as typed ("1.5", "1,5", " 2 ") to a number; null when it is not one. */
export function parseHours(text: string): number | null {
  const cleaned = text.trim().replace(',', '.');
  if (!/^\d+(\.\d+)?$|^\.\d+$/.test(cleaned)) return null;
  return Number(cleaned);
}

/**
 * What the new line is called when the title is left empty, as the server names it: the note's first
 * line, cut at a word near the 120 characters a title may have.
 */
export function titleHint(note: string, max = 120): string {
  const line = (note.split(/\r?\n/).find((l) => l.trim()) ?? note).trim().replace(/\s+/g, ' ');
  if (line.length <= max) return line;
  const cut = line.slice(0, max - 1);
  const space = cut.lastIndexOf(' ');
  return `${(space > max / 2 ? cut.slice(0, space) : cut).trimEnd()}…`;
}

/** "Approved by Harriet Quenby through the approval link", "Declined by Nell Ashby by phone". */
export function answeredText(finding: FindingDto): string {
  const verb = FINDING_ANSWER_WORDS[finding.answer];
  const by = finding.answeredBy ? ` by ${finding.answeredBy}` : '';
  const how = finding.answerChannel ? ` ${ANSWER_CHANNEL_WORDS[finding.answerChannel]}` : '';
  return `${verb}${by}${how}`;
}

/** Where the last approval link stands, in words for the advisor. */
export function linkStateText(link: ApprovalLinkDto, formatWhen: (iso: string) => string): string {
  const sent = `Approval link sent ${formatWhen(link.sentAt)} to ${link.sentTo.map(readableContact).join(' and ')}`;
  switch (link.status) {
    case 'active':
      return `${sent}; it works until ${formatWhen(link.expiresAt)}.`;
    case 'expired':
      return `${sent}; it expired ${formatWhen(link.expiresAt)} without an answer.`;
    case 'revoked':
      return `${sent}; it was withdrawn.`;
    case 'used':
      return `${sent}; the customer answered through it.`;
  }
}

const readableContact = (contact: string) => (contact.startsWith('+') ? formatPhone(contact) : contact);
