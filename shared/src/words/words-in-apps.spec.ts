import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import * as words from './index.js';

const root = fileURLToPath(new URL('../../../', import.meta.url));

/** Where people read Baytime's words: the three apps, and the server's messages, timecards and exports. */
const SOURCES = [
  'board/src',
  'kiosk/src',
  'server/src/findings',
  'server/src/mail',
  'server/src/reports',
  'server/src/payroll-export',
  'server/src/timecards',
  'server/src/punches',
  'server/src/work',
  'server/src/approvals',
];

/** Words that said the same thing another way before the word set, and must not come back. */
const OLD_VARIANTS: readonly [RegExp, string][] = [
  [/\bWaiting for a technician\b/, 'a queued line is "Queued"'],
  [/^Waiting$/, 'a queued line is "Queued"'],
  [/^Unassigned$/, 'a queued line is "Queued"'],
  [/^Started$/, 'a working line is "Working"'],
  [/\bShift in\b|\bStart shift\b|\bEnd shift\b/, 'punches are named by PUNCH_WORDS'],
  [/\bClock on Job\b|\bClock on job\b|\bClock off job\b/i, 'punches are named by PUNCH_WORDS'],
  [/\bMeal break start\b|\bStart (meal|rest) break\b/, 'punches are named by PUNCH_WORDS'],
  [/\bLink lost\b|\bReconnecting\b|^Live$/, 'the link is named by CONNECTION_WORDS'],
  [/\bStalled\b/, 'a timer that will not get there says so (TIMER_STATE_WORDS)'],
  [/≈/, 'a forecast says "about" (aboutWords)'],
  [/\bTest mailbox\b/, 'the local mailbox is "Sent messages"'],
  [/\bFixed hold\b|\bhold finished\b/i, 'the fixed wait is a "Set time"'],
  [/^L\d+\b|\sL\d+\b|^L$|\sL$/, 'a line is "line 2" and a skill "skill 3" (lineWords, skillWords)'],
  [/\bLevel \d\b|^Level $|^level $/, 'a skill is "skill 3" (skillWords)'],
];

/** The same letters meaning something else there: [file, text, what it means]. */
const OTHER_MEANINGS: readonly [string, string, string][] = [
  ['board/src/features/shop/components/shop-settings-form.tsx', 'Open', 'the shop is open that weekday'],
  ['board/src/features/shop/components/shop-settings-form.tsx', 'Closed', 'the shop is closed that weekday'],
  ['board/src/features/customer-approval/components/approval-page.tsx', 'Parts', 'the price of the parts'],
];

/** Every word of the set: any of them written out in an app is a second copy that will drift. */
function wordSetValues(): Set<string> {
  const values = new Set<string>();
  for (const value of Object.values(words))
    if (value && typeof value === 'object' && !Array.isArray(value))
      for (const word of Object.values(value as Record<string, unknown>))
        // A lowercase single word ("meal", "online") is also a stored code, which code must write.
        if (typeof word === 'string' && !/^[a-z-]+$/.test(word)) values.add(word);
  return values;
}

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return sourceFiles(path);
    return /\.(ts|tsx)$/.test(name) && !/\.spec\.tsx?$/.test(name) ? [path] : [];
  });
}

/** The text a file shows people: string and template literal parts, and JSX text, with comments gone. */
function shownTexts(source: string): string[] {
  const code = source.replace(/\/\*[\s\S]*?\*\//g, '').replace(/(^|[^:'"`\\])\/\/.*$/gm, '$1');
  const texts: string[] = [];
  for (const [, single, double] of code.matchAll(/'((?:[^'\\\n]|\\.)*)'|"((?:[^"\\\n]|\\.)*)"/g))
    texts.push(single ?? double ?? '');
  for (const [, template] of code.matchAll(/`((?:[^`\\]|\\.)*)`/g))
    texts.push(...template!.split(/\$\{[^}]*\}/));
  for (const [, text] of code.matchAll(/[>}]([^<>{}=;()]+)[<{]/g)) texts.push(text!);
  return texts.map((text) => text.trim()).filter(Boolean);
}

describe('words in the apps', () => {
  const known = wordSetValues();
  const files = SOURCES.flatMap((dir) => sourceFiles(join(root, dir)));

  it('finds the apps’ sources and the word set', () => {
    expect(files.length).toBeGreaterThan(100);
    expect(known).toContain('Queued');
    expect(known).toContain('Shift start');
  });

  it('writes no status, state, punch, severity, connection or timer word outside the word set', () => {
    const found: string[] = [];
    for (const file of files) {
      const where = relative(root, file);
      for (const text of shownTexts(readFileSync(file, 'utf8'))) {
        const otherMeaning = OTHER_MEANINGS.some(([file, other]) => file === where && other === text);
        if (known.has(text) && !otherMeaning)
          found.push(`${where}: "${text}" is in the word set: use it from there`);
        for (const [variant, why] of OLD_VARIANTS)
          if (variant.test(text)) found.push(`${where}: "${text}": ${why}`);
      }
    }
    expect(found).toEqual([]);
  });
});
