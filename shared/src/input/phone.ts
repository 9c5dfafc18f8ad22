import { parsePhoneNumberFromString } from 'libphonenumber-js';
import { z } from 'zod';
import { plainText } from './fields.js';

/**
 * Numbers typed without a country code are read as North American ones (the shop's customers);
 * others are typed with their `+` and country code.
 */
export const PHONE_REGION = 'US';

/** A phone number as typed, in E.164 (`+16085550142`) when it is a real number; null otherwise. */
export function normalisePhone(text: string): string | null {
  const parsed = parsePhoneNumberFromString(text.trim(), PHONE_REGION);
  return parsed?.isValid() ? parsed.number : null;
}

/** How a stored number reads to a person: national for North American ones, international otherwise. */
export function formatPhone(stored: string): string {
  const parsed = parsePhoneNumberFromString(stored, PHONE_REGION);
  if (!parsed?.isValid()) return stored;
  return parsed.country === PHONE_REGION ? parsed.formatNational() : parsed.formatInternational();
}

export const PHONE_MESSAGE = 'Not a phone number: give the area code, like (608) 555-0142';

/** A phone number as typed, in E.164; empty is null. */
const typedPhone = plainText(30).transform((text, ctx) => {
  if (text === '') return null;
  const phone = normalisePhone(text);
  if (phone) return phone;
  ctx.addIssue({ code: 'custom', message: PHONE_MESSAGE, input: text });
  return z.NEVER;
});

/** A phone number typed into a form, stored in E.164; empty is left out. */
export const phoneSchema = typedPhone.transform((phone) => phone ?? undefined).optional();

/** A phone number in a correction, stored in E.164: empty or null takes it off, left out keeps it. */
export const phoneEditSchema = typedPhone.nullable().optional();
