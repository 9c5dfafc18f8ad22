import {
  createRepairOrderSchema,
  formatPhone,
  modelYearFromVin,
  normalizeVin,
  shopDayKey,
  shopLocalInstant,
  vinSchema,
  type CreateRepairOrderBody,
  type KnownVehicle,
  type OpeningHours,
  type OperationDto,
} from '@baytime/shared';

export type FieldErrors = Record<string, string | undefined>;

export interface LineDraft {
  /** Stable React key for the row. */
  key: string;
  title: string;
  bookHours: string;
  /** "" leaves the server's default. */
  skillLevel: string;
}

export interface IntakeDraft {
  customer: { name: string; phone: string; email: string };
  vehicle: { vin: string; year: string; make: string; model: string; plate: string; odometer: string };
  concern: string;
  promisedDate: string;
  promisedTime: string;
  lines: LineDraft[];
}

let lineCounter = 0;
export function emptyLine(): LineDraft {
  lineCounter += 1;
  return { key: `line-${lineCounter}`, title: '', bookHours: '', skillLevel: '' };
}

export function emptyDraft(): IntakeDraft {
  return {
    customer: { name: '', phone: '', email: '' },
    vehicle: { vin: '', year: '', make: '', model: '', plate: '', odometer: '' },
    concern: '',
    promisedDate: '',
    promisedTime: '',
    lines: [emptyLine()],
  };
}

export type VinState = 'empty' | 'partial' | 'invalid' | 'valid';

export interface VinFacts {
  state: VinState;
  /** What to show under the field. */
  message: string | null;
  /** The model year position 10 stands for, once the VIN is valid. */
  year: number | null;
}

/** The VIN as the advisor types or pastes it, checked live (the same `vinSchema` the server uses). */
export function vinFacts(raw: string, now: Date = new Date()): VinFacts {
  const vin = normalizeVin(raw);
  if (!vin) return { state: 'empty', message: null, year: null };
  if (/[IOQ]/.test(vin)) return { state: 'invalid', message: 'VINs never use I, O or Q', year: null };
  if (!/^[A-Z0-9]*$/.test(vin))
    return { state: 'invalid', message: 'A VIN has only letters and digits', year: null };
  if (vin.length < 17) return { state: 'partial', message: `${vin.length} of 17 characters`, year: null };
  const parsed = vinSchema.safeParse(vin);
  if (!parsed.success)
    return { state: 'invalid', message: parsed.error.issues[0]?.message ?? 'Not a valid VIN', year: null };
  const year = modelYearFromVin(vin, now);
  return {
    state: 'valid',
    message: year
      ? `Check digit correct · 10th character ${vin[9]}: model year ${year}`
      : 'Check digit correct',
    year,
  };
}

/** Hours typed as "1.5" or "1,5"; null when it is not a number. */
export function parseHours(text: string): number | null {
  const cleaned = text.trim().replace(',', '.');
  if (!/^\d+(\.\d*)?$|^\.\d+$/.test(cleaned)) return null;
  return Number(cleaned);
}

/** Whole numbers typed with or without thousands separators: "150,273". */
export function parseWhole(text: string): number | null {
  const cleaned = text.trim().replace(/[,\s]/g, '');
  return /^\d+$/.test(cleaned) ? Number(cleaned) : null;
}

export function bookHoursTotal(lines: readonly LineDraft[]): number {
  return lines.reduce((sum, line) => sum + (parseHours(line.bookHours) ?? 0), 0);
}

const optional = (text: string) => (text.trim() ? text.trim() : undefined);

/** Plain messages for the schema's generic checks. */
function friendlyMessage(
  key: string,
  issue: { code: string; message: string; origin?: string; maximum?: unknown },
) {
  if (/^lines\.\d+\.title$/.test(key) && issue.code === 'too_small') return 'Give the line a title';
  if (/^lines\.\d+\.bookHours$/.test(key)) return 'Book hours are 0.1 to 99.9';
  if (key === 'odometerOverrideReason' || key === 'vinOverrideReason') return 'Say why, in a few words';
  if (key === 'lines' && issue.code === 'too_big') return 'At most 30 lines on one repair order';
  if (issue.code === 'too_big' && issue.origin === 'string')
    return `At most ${String(issue.maximum)} characters`;
  return issue.message;
}

export interface IntakeResult {
  body: CreateRepairOrderBody | null;
  errors: FieldErrors;
}

/** Reasons the advisor gave to save what the checks refused: a lower odometer, a VIN outside the rules. */
export interface OverrideReasons {
  odometer?: string;
  vin?: string;
}

export const PROMISE_PASSED = 'That time has already passed: promise a later one';

/**
 * The form's text to the request body, checked by the same schema as the server. Error keys are the
 * body's paths ("vehicle.vin", "lines.0.bookHours"), plus "promised" for the date and time pair. A
 * promise already past is refused, as the server does.
 */
export function toRepairOrder(
  draft: IntakeDraft,
  timeZone: string,
  reasons: OverrideReasons = {},
  now: Date = new Date(),
): IntakeResult {
  const errors: FieldErrors = {};
  const year = parseWhole(draft.vehicle.year);
  const odometer = parseWhole(draft.vehicle.odometer);
  if (draft.vehicle.year.trim() && year === null) errors['vehicle.year'] = 'A year, like 2019';
  if (!draft.vehicle.year.trim()) errors['vehicle.year'] = 'Enter the model year';
  if (!draft.vehicle.odometer.trim()) errors['vehicle.odometer'] = 'Enter the odometer reading';
  else if (odometer === null) errors['vehicle.odometer'] = 'Whole miles or kilometres, like 84,210';

  const promised = promisedInstant(draft.promisedDate, draft.promisedTime, timeZone);
  const promisedAt = promised?.toISOString();
  if (!promised && (draft.promisedDate.trim() || draft.promisedTime.trim()))
    errors.promised = draft.promisedDate.trim() ? 'Pick a time too' : 'Pick a date too';
  else if (promised && promised <= now) errors.promised = PROMISE_PASSED;

  const lines = draft.lines.map((line, index) => {
    const hours = parseHours(line.bookHours);
    if (!line.bookHours.trim()) errors[`lines.${index}.bookHours`] = 'Enter book hours';
    else if (hours === null) errors[`lines.${index}.bookHours`] = 'Hours, like 1.5';
    return {
      title: line.title,
      bookHours: hours ?? Number.NaN,
      ...(line.skillLevel ? { skillLevel: Number(line.skillLevel) } : {}),
    };
  });

  const candidate = {
    customer: {
      name: draft.customer.name,
      phone: optional(draft.customer.phone),
      email: optional(draft.customer.email),
    },
    vehicle: {
      vin: draft.vehicle.vin,
      year: year ?? Number.NaN,
      make: draft.vehicle.make,
      model: draft.vehicle.model,
      plate: optional(draft.vehicle.plate),
      odometer: odometer ?? Number.NaN,
    },
    concern: draft.concern,
    promisedAt,
    lines,
    odometerOverrideReason: reasons.odometer,
    vinOverrideReason: reasons.vin,
  };
  const parsed = createRepairOrderSchema.safeParse(candidate);
  if (!parsed.success)
    for (const issue of parsed.error.issues) {
      const key = issue.path.map(String).join('.');
      // The text checks above already said what is wrong with a number that did not parse.
      errors[key] ??= friendlyMessage(key, issue as Parameters<typeof friendlyMessage>[1]);
    }
  return { body: parsed.success && Object.keys(errors).length === 0 ? parsed.data : null, errors };
}

/** The promised date and time ('YYYY-MM-DD', 'HH:MM') as the shop's clock reads them; null until both are set. */
export function promisedInstant(date: string, time: string, timeZone: string): Date | null {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(date.trim()) || !/^\d{2}:\d{2}$/.test(time.trim())) return null;
  return shopLocalInstant(date.trim(), time.trim(), timeZone);
}

/**
 * Whether what is wrong with the VIN is only what a reason can waive (a check digit, a length other
 * than 17, a model year before 1981), as for a vehicle built abroad or before 1981.
 */
export function vinNeedsReason(draft: IntakeDraft, timeZone: string, now: Date = new Date()): boolean {
  const vinErrors = (errors: FieldErrors) => Boolean(errors['vehicle.vin'] ?? errors['vehicle.year']);
  return (
    vinErrors(toRepairOrder(draft, timeZone, {}, now).errors) &&
    !vinErrors(toRepairOrder(draft, timeZone, { vin: 'A reason' }, now).errors)
  );
}

/** A server field path to the form's key: the same, except the promised time lives in two inputs. */
export function formKey(path: string): string {
  return path === 'promisedAt' ? 'promised' : path;
}

export interface PromiseChoice {
  label: string;
  date: string;
  time: string;
}

function addDays(day: string, days: number): string {
  const [y, m, d] = day.split('-').map(Number);
  const next = new Date(Date.UTC(y!, m! - 1, d! + days));
  return next.toISOString().slice(0, 10);
}

function weekday(day: string): number {
  const [y, m, d] = day.split('-').map(Number);
  return new Date(Date.UTC(y!, m! - 1, d!)).getUTCDay();
}

/** "17:30" as the office reads times elsewhere: "5:30 PM". */
export function clockText(hhmm: string): string {
  const [hours = 0, minutes = 0] = hhmm.split(':').map(Number);
  const period = hours < 12 ? 'AM' : 'PM';
  return `${hours % 12 || 12}:${String(minutes).padStart(2, '0')} ${period}`;
}

/** Closing time today (while still ahead) and on the next open day: the usual promises. */
export function promiseChoices(openingHours: OpeningHours, timeZone: string, now: Date): PromiseChoice[] {
  const today = shopDayKey(now, timeZone);
  const choices: PromiseChoice[] = [];
  for (let offset = 0; offset < 8 && choices.length < 2; offset++) {
    const day = addDays(today, offset);
    const hours = openingHours[weekday(day)];
    if (!hours) continue;
    if (offset === 0 && shopLocalInstant(day, hours.close, timeZone) <= now) continue;
    const name =
      offset === 0
        ? 'Today'
        : offset === 1
          ? 'Tomorrow'
          : new Intl.DateTimeFormat('en-US', { weekday: 'long', timeZone: 'UTC' }).format(
              new Date(`${day}T12:00:00Z`),
            );
    choices.push({ label: `${name} at close, ${clockText(hours.close)}`, date: day, time: hours.close });
  }
  return choices;
}

/**
 * The returning customer's details copied into the form: name, phone and e-mail, and the vehicle as
 * the shop knows it. The odometer is left to read off the dash.
 */
export function withReturningCustomer(draft: IntakeDraft, known: KnownVehicle): IntakeDraft {
  return {
    ...draft,
    customer: {
      name: known.customer.name,
      phone: known.customer.phone ? formatPhone(known.customer.phone) : '',
      email: known.customer.email ?? '',
    },
    vehicle: {
      ...draft.vehicle,
      year: String(known.year),
      make: known.make,
      model: known.model,
      plate: known.plate ?? '',
    },
  };
}

/** Whether copying the returning customer's details would change the form. */
export function differsFromReturning(draft: IntakeDraft, known: KnownVehicle): boolean {
  return JSON.stringify(withReturningCustomer(draft, known)) !== JSON.stringify(draft);
}

/** Filling a line from the shop's menu of operations. */
export function lineFromOperation(line: LineDraft, operation: OperationDto): LineDraft {
  return {
    ...line,
    title: operation.title,
    bookHours: String(operation.defaultBookHours),
    skillLevel: String(operation.skillLevel),
  };
}

/** Menu entries whose title holds every typed word. */
export function matchOperations(
  operations: readonly OperationDto[],
  text: string,
  limit = 12,
): OperationDto[] {
  const words = text.trim().toLowerCase().split(/\s+/).filter(Boolean);
  return operations
    .filter((operation) => operation.active !== false)
    .filter((operation) => words.every((word) => operation.title.toLowerCase().includes(word)))
    .slice(0, limit);
}
