import { describe, expect, it } from 'vitest';
import { addUserFormSchema, editUserFormSchema, EMPTY_USER, fieldsOf } from './user-form';

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
    const fields = fieldsOf({
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
    });
    expect(fields).toMatchObject({ paidOvertime: false, flatRate: '28.50', pin: '' });
    // An edit with the PIN left empty keeps the PIN: it is not sent.
    expect(JSON.stringify(editUserFormSchema.parse(fields))).not.toContain('"pin"');
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
});
