import { describe, expect, it } from 'vitest';
import type { UserDto } from '@baytime/shared';
import {
  addRefusal,
  addUserFormSchema,
  editUserFormSchema,
  EMPTY_USER,
  fieldsOf,
  rateToCome,
  refusalAbout,
} from './user-form';

const tamsin: UserDto = {
  id: 1,
  name: 'Tamsin Reeve',
  role: 'technician',
  email: null,
  badge: '2601',
  skillLevel: 2,
  flatRateCents: 2850,
  hourlyRateCents: 1500,
  overtimeExempt: true,
  active: true,
  payType: 'flat-rate',
  guaranteeCents: 0,
  payRates: [],
};
const technician = { ...EMPTY_USER, name: 'Tamsin Reeve', badge: '2601', pin: '2468', flatRate: '$28.50' };

describe('the people form', () => {
  it('saves a person with "Paid overtime" switched on as paid overtime, not exempt (bug 8)', () => {
    expect(addUserFormSchema.parse({ ...technician, paidOvertime: true })).toMatchObject({
      overtimeExempt: false,
      flatRateCents: 2850,
    });
    expect(addUserFormSchema.parse({ ...technician, paidOvertime: false }).overtimeExempt).toBe(true);
  });

  it('reads an exempt person back with the switch off', () => {
    const fields = fieldsOf(tamsin);
    expect(fields).toMatchObject({ paidOvertime: false, flatRate: '28.50', pin: '' });
    // An edit with the PIN left empty keeps the PIN: it is not sent.
    expect(JSON.stringify(editUserFormSchema.parse(fields))).not.toContain('"pin"');
  });

  it('sends a new technician’s pay type and hourly guarantee in cents, and asks for the guarantee', () => {
    const guaranteed = { ...technician, payType: 'flat-rate-guarantee' as const, guarantee: '11' };
    expect(addUserFormSchema.parse(guaranteed)).toMatchObject({
      payType: 'flat-rate-guarantee',
      flatRateCents: 2850,
      guaranteeCents: 1100,
    });
    const none = addUserFormSchema.safeParse({ ...guaranteed, guarantee: '' });
    expect(none.error!.issues.map((issue) => [issue.path.join('.'), issue.message])).toEqual([
      ['guarantee', 'Give the hourly guarantee for productive time'],
    ]);
  });

  it('leaves rates out of an edit: they change from a date in the pay dialog', () => {
    const body = editUserFormSchema.parse({ ...technician, hourlyRate: '19' });
    expect(Object.keys(body).sort()).toEqual(['badge', 'name', 'pin', 'role', 'skillLevel']);
  });

  it('puts the shared schema’s refusals on the fields the person typed in', () => {
    const result = addUserFormSchema.safeParse({ ...technician, badge: '', flatRate: 'lots' });
    expect(result.success).toBe(false);
    expect(result.error!.issues.map((issue) => [issue.path.join('.'), issue.message])).toEqual([
      ['flatRate', 'Type an amount in dollars, like 28.50'],
    ]);
    const noBadge = addUserFormSchema.safeParse({ ...technician, badge: '' });
    expect(noBadge.error!.issues.map((issue) => [issue.path.join('.'), issue.message])).toEqual([
      ['badge', 'A technician needs a badge'],
    ]);
  });

  it('shows a rate as still to come until its first day begins in the shop’s time zone, not in UTC', () => {
    const rate = { ...tamsin, effectiveFrom: '2026-12-05', recordedAt: '2026-12-04T15:00:00.000Z' };
    const raised = { ...tamsin, payRates: [rate] };
    // 8 pm on Friday Dec 4 in Chicago is already Saturday Dec 5 in UTC.
    expect(rateToCome(raised, new Date('2026-12-05T02:00:00Z'), 'America/Chicago')).toBe(rate);
    expect(rateToCome(raised, new Date('2026-12-05T06:00:00Z'), 'America/Chicago')).toBeNull();
    expect(rateToCome(tamsin, new Date('2026-12-05T02:00:00Z'), 'America/Chicago')).toBeNull();
  });

  it('names the person once when the table shows a refused change', () => {
    const onShift = 'Tamsin Reeve is on shift: clock them out at the kiosk or on their timecard first';
    expect(refusalAbout(tamsin, onShift)).toBe(onShift);
    expect(refusalAbout(tamsin, 'Your role cannot change this.')).toBe(
      'Tamsin Reeve: Your role cannot change this.',
    );
  });

  it('asks for the rate a new technician is paid by, so no one is added at $0 an hour', () => {
    const issues = (fields: object) =>
      addUserFormSchema
        .safeParse({ ...technician, ...fields })
        .error?.issues.map((issue) => [issue.path.join('.'), issue.message]);
    expect(issues({ flatRate: '' })).toEqual([['flatRate', 'Give the flat rate per flagged hour']]);
    expect(issues({ flatRate: '$0.00' })).toEqual([['flatRate', 'Give the flat rate per flagged hour']]);
    expect(issues({ payType: 'hourly', flatRate: '', hourlyRate: '' })).toEqual([
      ['hourlyRate', 'Give the hourly rate'],
    ]);
    expect(issues({ payType: 'hourly', flatRate: '', hourlyRate: '22' })).toBeUndefined();
  });
});

describe(addRefusal.name, () => {
  it('puts a taken badge or e-mail on its field', () => {
    expect(addRefusal('That e-mail or badge is already in use', true)).toEqual({
      field: 'badge',
      message: 'Someone already has this badge',
    });
    expect(addRefusal('That e-mail or badge is already in use', false)).toEqual({
      field: 'email',
      message: 'Someone already uses this e-mail',
    });
  });

  it("says any other refusal in the server's words, not as a taken badge", () => {
    const closed =
      'That rate would change the Week of Sun, Nov 22, 2026 pay week, which is closed: date it after that week, or reopen it';
    expect(addRefusal(closed, true)).toEqual({ field: null, message: closed });
  });
});
