import { describe, expect, it } from 'vitest';
import { sentToWords } from './notice-words.js';

describe(sentToWords.name, () => {
  it('says where a notice went, phones as a person reads them', () => {
    expect(sentToWords('ada@example.test', '+16085550177')).toBe(
      'by e-mail to ada@example.test and by text to (608) 555-0177',
    );
    expect(sentToWords(null, '+16085550177')).toBe('by text to (608) 555-0177');
    expect(sentToWords('ada@example.test', undefined)).toBe('by e-mail to ada@example.test');
  });
});
