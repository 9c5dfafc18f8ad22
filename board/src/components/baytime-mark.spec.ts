import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { baytimeMarkSvg } from '@baytime/shared';

describe('the favicon', () => {
  it('is the one Baytime mark', () => {
    const favicon = readFileSync(new URL('../../public/favicon.svg', import.meta.url), 'utf8');
    expect(favicon.trim()).toBe(baytimeMarkSvg());
  });
});
