import { describe, expect, it } from 'vitest';
import { formatPhone, normalisePhone, phoneEditSchema, phoneSchema } from './phone.js';

describe('normalisePhone', () => {
  it.each([
    ['(608) 555-0142', '+16085550142'],
    ['608.555.0142', '+16085550142'],
    ['+1 608 555 0142', '+16085550142'],
    ['1-608-555-0142', '+16085550142'],
    ['+44 20 7946 0958', '+442079460958'],
  ])('reads %s as %s', (typed, stored) => {
    expect(normalisePhone(typed)).toBe(stored);
  });

  it.each(['555-0142', '12', '(555) 201-3344', 'call me'])('refuses %s', (typed) => {
    expect(normalisePhone(typed)).toBeNull();
  });
});

describe('formatPhone', () => {
  it('shows a North American number nationally and others internationally', () => {
    expect(formatPhone('+16085550142')).toBe('(608) 555-0142');
    expect(formatPhone('+442079460958')).toBe('+44 20 7946 0958');
    expect(formatPhone('555-0142')).toBe('555-0142');
  });
});

describe('phoneSchema', () => {
  it('stores E.164, leaves out an empty field and says what a refused number lacks', () => {
    expect(phoneSchema.parse(' (608) 555-0142 ')).toBe('+16085550142');
    expect(phoneSchema.parse('')).toBeUndefined();
    expect(phoneSchema.safeParse('555-0142').error?.issues[0]?.message).toBe(
      'Not a phone number: give the area code, like (608) 555-0142',
    );
  });
});

describe('phoneEditSchema', () => {
  it('takes the number off when empty or null, keeps it when left out, and refuses what phoneSchema refuses', () => {
    expect(phoneEditSchema.parse('')).toBeNull();
    expect(phoneEditSchema.parse('   ')).toBeNull();
    expect(phoneEditSchema.parse(null)).toBeNull();
    expect(phoneEditSchema.parse(undefined)).toBeUndefined();
    expect(phoneEditSchema.parse('(608) 555-0142')).toBe('+16085550142');
    expect(phoneEditSchema.safeParse('555-0142').error?.issues[0]?.message).toBe(
      'Not a phone number: give the area code, like (608) 555-0142',
    );
  });
});
