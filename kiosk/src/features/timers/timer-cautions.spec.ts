// @vitest-environment node
import { describe, expect, it } from 'vitest';
import { TIMER_KINDS } from '@baytime/shared';
import { TIMER_CAUTIONS } from './timer-cautions';

const wordsOf = (kind: keyof typeof TIMER_CAUTIONS) => {
  const { heading, checks, source } = TIMER_CAUTIONS[kind];
  return [heading, ...checks, source].join('\n');
};

describe('TIMER_CAUTIONS', () => {
  it('warns of a running engine before a warm-up', () => {
    const words = wordsOf('warm-up');
    for (const check of [
      /engine runs/i,
      /exhaust extraction/i,
      /parking brake/i,
      /chock/i,
      /moving parts/i,
      /hot fluid/i,
    ])
      expect(words).toMatch(check);
  });

  it('warns of hot parts and a pressurised cooling system before a cool-down, not of a running engine', () => {
    const words = wordsOf('cool-down');
    expect(words).toMatch(/radiator cap/i);
    expect(words).toMatch(/pressure/i);
    expect(words).toMatch(/hot fluid and surfaces/i);
    expect(words).not.toMatch(/engine runs|exhaust extraction|chock/i);
  });

  it('keeps a set time short: the job’s own cautions', () => {
    expect(TIMER_CAUTIONS['set-time'].checks).toEqual([]);
    expect(wordsOf('set-time')).toMatch(/job’s own cautions/);
  });

  it('defers to the vehicle maker for every kind', () => {
    for (const kind of TIMER_KINDS) expect(TIMER_CAUTIONS[kind].source).toMatch(/vehicle maker’s procedure/);
  });
});
