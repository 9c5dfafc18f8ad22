import { describe, expect, it } from 'vitest';
import type { FindingDto } from '@baytime/shared';
import {
  answeredText,
  groupAnswered,
  linkStateText,
  parseHours,
  sortPending,
  titleHint,
} from './findings-model';

function finding(id: number, extra: Partial<FindingDto> = {}): FindingDto {
  return {
    id,
    jobLineId: 10,
    lineNo: 1,
    lineTitle: 'Replace thermostat',
    lineStatus: 'working',
    holdReason: null,
    repairOrderId: 1,
    repairOrderNumber: '4497',
    vehicle: '2019 Corvan Strata',
    customerName: 'Ada Finch',
    customerHasEmail: true,
    customerHasMobile: true,
    technicianId: 4,
    technicianName: 'Dana Okafor',
    note: 'Metal flakes on the pan magnet',
    severity: 'soon',
    suggestedHours: 1.5,
    customerWording: null,
    bookHours: null,
    partsCents: null,
    priceCents: null,
    answer: 'pending',
    answerChannel: null,
    answeredBy: null,
    answeredAt: null,
    answerNote: null,
    createdLineId: null,
    approvalRequestedAt: null,
    approvalLink: null,
    createdAt: '2026-12-01T14:00:00Z',
    photos: [],
    ...extra,
  };
}

describe('findings inbox model', () => {
  it('says who answered and how', () => {
    expect(
      answeredText(finding(1, { answer: 'approved', answeredBy: 'Ada Finch', answerChannel: 'link' })),
    ).toBe('Approved by Ada Finch through the approval link');
    expect(
      answeredText(finding(1, { answer: 'declined', answeredBy: 'Nell Ashby', answerChannel: 'in-person' })),
    ).toBe('Declined by Nell Ashby in person');
    expect(answeredText(finding(1, { answer: 'approved', answeredBy: 'Nell Ashby' }))).toBe(
      'Approved by Nell Ashby',
    );
  });

  it('says where the last link stands', () => {
    const link = {
      id: 3,
      sentAt: 'sent',
      expiresAt: 'until',
      status: 'active' as const,
      sentTo: ['ada@example.test', '+16085550177'],
    };
    const when = (iso: string) => `<${iso}>`;
    expect(linkStateText(link, when)).toBe(
      'Approval link sent <sent> to ada@example.test and (608) 555-0177; it works until <until>.',
    );
    expect(linkStateText({ ...link, status: 'revoked' }, when)).toMatch(/; it was withdrawn\.$/);
    expect(linkStateText({ ...link, status: 'used' }, when)).toMatch(/; the customer answered through it\.$/);
  });

  it('puts safety first, then the longest waiting', () => {
    const sorted = sortPending([
      finding(1, { severity: 'watch', createdAt: '2026-12-01T08:00:00Z' }),
      finding(2, { severity: 'soon', createdAt: '2026-12-01T12:00:00Z' }),
      finding(3, { severity: 'safety-now', createdAt: '2026-12-01T13:00:00Z' }),
      finding(4, { severity: 'soon', createdAt: '2026-12-01T09:00:00Z' }),
    ]);
    expect(sorted.map((f) => f.id)).toEqual([3, 4, 2, 1]);
  });

  it('groups answered findings by repair order, latest answer first', () => {
    const groups = groupAnswered([
      finding(1, { answer: 'approved', answeredAt: '2026-12-01T10:00:00Z' }),
      finding(2, {
        answer: 'declined',
        answeredAt: '2026-12-01T12:00:00Z',
        repairOrderId: 2,
        repairOrderNumber: '4501',
      }),
      finding(3, { answer: 'declined', answeredAt: '2026-12-01T11:00:00Z' }),
    ]);
    expect(groups.map((g) => g.repairOrderNumber)).toEqual(['4501', '4497']);
    expect(groups[1]!.findings.map((f) => f.id)).toEqual([3, 1]);
  });

  it('reads book hours as people type them', () => {
    expect(parseHours('1.5')).toBe(1.5);
    expect(parseHours(' 2 ')).toBe(2);
    expect(parseHours('0,8')).toBe(0.8);
    expect(parseHours('.5')).toBe(0.5);
    expect(parseHours('one')).toBeNull();
    expect(parseHours('')).toBeNull();
    expect(parseHours('-1')).toBeNull();
  });

  it('names the new line from the note as the server will', () => {
    expect(titleHint('\n  Pan   magnet flakes\nmore text')).toBe('Pan magnet flakes');
    expect(titleHint('x'.repeat(100), 10)).toBe('xxxxxxxxx…');
    expect(titleHint('worn front pads and a scored rotor', 20)).toBe('worn front pads…');
  });
});
