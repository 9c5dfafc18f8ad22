import { describe, expect, it } from 'vitest';
import {
  createFindingSchema,
  findingAnswerSchema,
  findingsQuerySchema,
} from '../findings/findings.schema.js';
import { findingQuoteSchema } from '../approvals/approvals.schema.js';
import { correctionSchema, createPunchSchema } from '../punches/punches.schema.js';
import { timecardQuerySchema } from '../punches/timecard.schema.js';
import { shopSettingsSchema } from '../shop/shop.schema.js';
import { isoWeekSchema } from '../time/workweek.js';
import { startTimerSchema, timerReadingSchema } from '../timers/timers.schema.js';
import { createUserSchema } from '../users/users.schema.js';
import { makeVin, vehicleDetailsSchema } from '../vehicles/vin.js';
import { createRepairOrderSchema, operationInputSchema, patchJobLineSchema } from '../work/work.schema.js';

const firstMessage = (result: { success: boolean; error?: { issues: { message: string }[] } }) =>
  result.error?.issues[0]?.message ?? 'accepted';

const vehicle = {
  vin: makeVin('1HGCM826AA004352'),
  year: 2010,
  make: 'Halvard',
  model: 'Tessel',
  odometer: 1,
};
const repairOrder = {
  customer: { name: 'Rosa Quill' },
  vehicle,
  concern: 'Noise from the front',
  lines: [{ title: 'Inspect front suspension', bookHours: 1 }],
};

describe('book hours', () => {
  it('run from 0.1 to 99.9 on repair-order lines, operations, approved and quoted findings', () => {
    const line = (bookHours: number) =>
      firstMessage(createRepairOrderSchema.safeParse({ ...repairOrder, lines: [{ title: 'x', bookHours }] }));
    expect(line(0.1)).toBe('accepted');
    expect(line(99.9)).toBe('accepted');
    // A tiny book time gave a near-zero efficiency whose forecast never ended.
    expect(line(1e-300)).toBe('Book hours is at least 0.1');
    expect(line(0)).toBe('Book hours is at least 0.1');
    expect(line(100)).toBe('Book hours is at most 99.9');
    expect(firstMessage(operationInputSchema.safeParse({ title: 'x', defaultBookHours: 1e-300 }))).toBe(
      'Book hours is at least 0.1',
    );
    expect(
      firstMessage(findingAnswerSchema.safeParse({ answer: 'approved', channel: 'phone', bookHours: 0 })),
    ).toBe('Book hours is at least 0.1');
    expect(
      firstMessage(findingQuoteSchema.safeParse({ customerWording: 'x', bookHours: 100, partsCents: null })),
    ).toBe('Book hours is at most 99.9');
  });
});

describe('numbers that arrive as text', () => {
  it('are read only in plain decimal', () => {
    const finding = (suggestedHours: string) =>
      createFindingSchema.safeParse({ note: 'Cracked hose', severity: 'soon', suggestedHours });
    expect(finding('1.5').data?.suggestedHours).toBe(1.5);
    expect(firstMessage(finding('0x10'))).toBe('Suggested hours is a number of hours, like 1.5');
    expect(firstMessage(finding('1e1'))).toBe('Suggested hours is a number of hours, like 1.5');
    expect(firstMessage(timecardQuerySchema.safeParse({ technicianId: '0x10' }))).toBe(
      'An id is a positive whole number',
    );
    expect(firstMessage(findingsQuerySchema.safeParse({ repairOrderId: '0x10' }))).toBe(
      'An id is a positive whole number',
    );
    expect(timecardQuerySchema.parse({ technicianId: '16' }).technicianId).toBe(16);
  });

  it('ids in bodies are positive safe integers', () => {
    const punch = (jobLineId: number) =>
      firstMessage(
        createPunchSchema.safeParse({
          id: '7c8e2f1a-9a55-4d47-b1cf-2bb0a3f7d9a1',
          kind: 'job-on',
          jobLineId,
        }),
      );
    expect(punch(3)).toBe('accepted');
    expect(punch(2 ** 53)).toBe('An id is a positive whole number');
    expect(punch(0)).toBe('An id is a positive whole number');
  });
});

describe('dates', () => {
  it('are refused before 2000 and more than two years ahead in corrections, completedAt and promisedAt', () => {
    const correction = (at: string) =>
      firstMessage(correctionSchema.safeParse({ technicianId: 1, kind: 'shift-in', at, reason: 'Forgot' }));
    expect(correction('2026-03-02T08:00:00-06:00')).toBe('accepted');
    expect(correction('1999-12-31T08:00:00Z')).toBe('Use a date in 2000 or later');
    const farAhead = new Date(Date.now() + 3 * 365 * 86_400_000).toISOString();
    expect(correction(farAhead)).toBe('Use a date less than two years ahead');
    expect(firstMessage(patchJobLineSchema.safeParse({ completedAt: '1970-01-01T00:00:00Z' }))).toBe(
      'Use a date in 2000 or later',
    );
    expect(firstMessage(createRepairOrderSchema.safeParse({ ...repairOrder, promisedAt: farAhead }))).toBe(
      'Use a date less than two years ahead',
    );
    expect(firstMessage(timerReadingSchema.safeParse({ tempC: 40, at: '1969-07-20T20:17:00Z' }))).toBe(
      'Use a date in 2000 or later',
    );
  });

  it('report weeks too', () => {
    expect(firstMessage(isoWeekSchema.safeParse('2026-W05'))).toBe('accepted');
    expect(firstMessage(isoWeekSchema.safeParse('1999-W05'))).toBe('Use a week from 2000 to two years ahead');
    expect(firstMessage(isoWeekSchema.safeParse('9999-W05'))).toBe('Use a week from 2000 to two years ahead');
  });
});

describe('other ranges', () => {
  it('odometers stop at 2,000,000', () => {
    expect(firstMessage(vehicleDetailsSchema.safeParse({ ...vehicle, odometer: 2_000_000 }))).toBe(
      'accepted',
    );
    expect(firstMessage(vehicleDetailsSchema.safeParse({ ...vehicle, odometer: 2_000_001 }))).toBe(
      'More than 2,000,000 on the odometer: check the reading',
    );
  });

  it('temperatures and pay rates stay physical', () => {
    const warmUp = { jobLineId: 1, kind: 'warm-up', targetC: 45, cautionAcknowledged: true };
    expect(firstMessage(startTimerSchema.safeParse({ ...warmUp, targetC: 301 }))).toBe(
      'Above 300 °C: check the reading',
    );
    expect(firstMessage(startTimerSchema.safeParse({ ...warmUp, ambientC: 110 }))).toBe('accepted');
    expect(firstMessage(startTimerSchema.safeParse({ ...warmUp, ambientC: 1e6 }))).toBe(
      'Above 300 °C: check the reading',
    );
    expect(firstMessage(timerReadingSchema.safeParse({ tempC: -41 }))).toBe(
      'Below −40 °C: check the reading',
    );
    const technicianWith = (rates: object) =>
      firstMessage(
        createUserSchema.safeParse({ name: 'Ada', role: 'technician', badge: '2001', pin: '4321', ...rates }),
      );
    expect(technicianWith({ flatRateCents: 1_000_01 })).toBe('At most $1,000.00 an hour');
    expect(technicianWith({ hourlyRateCents: -1 })).toBe('A rate cannot be below $0.00');
  });
});

describe('free text in the schemas', () => {
  it('refuses empty-looking names, control characters and hidden direction marks', () => {
    const user = (name: string) =>
      firstMessage(createUserSchema.safeParse({ name, role: 'technician', badge: '2001', pin: '4321' }));
    expect(user('Ada Newhire')).toBe('accepted');
    expect(user('\u200B\u200B')).toBe('Enter a name');
    expect(user('Ada\u202Eeriwhen')).toBe('Remove the hidden text-direction characters');
    expect(firstMessage(shopSettingsSchema.shape.name.safeParse('Shop\u0007'))).toBe(
      'Keep it on one line, without control characters',
    );
    expect(
      firstMessage(createRepairOrderSchema.safeParse({ ...repairOrder, customer: { name: '\u3164' } })),
    ).toBe('Enter the customer’s name');
    expect(firstMessage(createFindingSchema.safeParse({ note: 'Leak\u0000', severity: 'soon' }))).toBe(
      'Remove the control characters',
    );
  });
});
