import { describe, expect, it } from 'vitest';
import { sentToText } from './notice-words';

describe(sentToText.name, () => {
  it('says where a notice went, phones as a person reads them', () => {
    const mail = { mailId: 1, to: 'ada@example.test', subject: 'x', attachments: [] };
    const text = { textId: 2, to: '+16085550177' };
    expect(sentToText({ mail, text })).toBe('by e-mail to ada@example.test and by text to (608) 555-0177');
    expect(sentToText({ mail: null, text })).toBe('by text to (608) 555-0177');
  });
});
