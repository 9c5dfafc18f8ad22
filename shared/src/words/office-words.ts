import type { AnswerChannel } from '../approvals/approvals.schema.js';
import type { ExceptionKind } from '../exceptions/exceptions.schema.js';
import type { PayType } from '../pay/pay-types.js';
import type { PartsState } from '../work/parts.schema.js';

export const EXCEPTION_TITLES: Record<ExceptionKind, string> = {
  'open-shift': 'Shift still open',
  'open-break': 'Break never ended',
  'long-rest': 'Rest break over 20 minutes',
  'short-meal': 'Meal shorter than the minimum',
  'held-punch': 'Late punch held for review',
  'done-unclocked': 'Done without clocked time',
};

export const PAY_TYPE_WORDS: Record<PayType, string> = {
  'flat-rate': 'Flat rate',
  hourly: 'Hourly',
  'flat-rate-guarantee': 'Flat rate with an hourly guarantee',
};

export const PARTS_STATE_WORDS: Readonly<Record<PartsState, string>> = {
  ordered: 'Ordered',
  'back-ordered': 'Back-ordered',
};

/** How an answer came, in words: "Approved by Ada Finch through the approval link". */
export const ANSWER_CHANNEL_WORDS: Record<AnswerChannel, string> = {
  link: 'through the approval link',
  phone: 'by phone',
  'in-person': 'in person',
};
