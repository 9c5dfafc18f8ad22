import { describe, expect, it } from 'vitest';
import { finishLineSchema, kioskDoneSchema } from './work.schema.js';

/** Each field's problems once, as the form shows them. */
const problems = (body: unknown) => [
  ...new Set(
    kioskDoneSchema.safeParse(body).error?.issues.map(({ path, message }) => `${path.join('.')}: ${message}`),
  ),
];

describe('kioskDoneSchema', () => {
  it('refuses a line marked done without a cause or a correction', () => {
    expect(problems({})).toEqual(['cause: Say what you found', 'correction: Say what you did']);
    expect(problems({ cause: '', correction: '' })).toEqual([
      'cause: Say what you found',
      'correction: Say what you did',
    ]);
  });

  it('refuses words that are only spaces, line breaks or a character or two', () => {
    expect(problems({ cause: '   \n\t ', correction: '\u200b\u00a0 ' })).toEqual([
      'cause: Say what you found',
      'correction: Say what you did',
    ]);
    expect(problems({ cause: ' ok ', correction: 'x' })).toEqual([
      'cause: Say what you found',
      'correction: Say what you did',
    ]);
  });

  it('takes a filled-in cause and correction, trimmed, and checks the vehicle next by default', () => {
    expect(
      kioskDoneSchema.parse({ cause: ' Worn pads, scored rotor\n', correction: 'Replaced pads and rotor' }),
    ).toEqual({ next: 'check', cause: 'Worn pads, scored rotor', correction: 'Replaced pads and rotor' });
  });

  it('leaves the foreman free to finish a line without words', () => {
    expect(finishLineSchema.safeParse({}).success).toBe(true);
  });
});
