import { Logger } from '@nestjs/common';
import { describe, expect, it, vi } from 'vitest';
import { keepServing } from './keep-serving.js';

describe(keepServing.name, () => {
  it('logs work that fails at once, or later in its steps, and lets the server go on', async () => {
    const logger = new Logger('Test');
    const error = vi.spyOn(logger, 'error').mockImplementation(() => undefined);
    keepServing(logger, 'Counting at once', () => {
      throw new Error('a bad row');
    });
    keepServing(logger, 'Counting in steps', async () => {
      await Promise.resolve();
      throw new Error('a bad setting');
    });
    await vi.waitFor(() => expect(error).toHaveBeenCalledTimes(2));
    expect(error.mock.calls.map(([message]) => message)).toEqual([
      'Counting at once failed: a bad row',
      'Counting in steps failed: a bad setting',
    ]);
  });
});
