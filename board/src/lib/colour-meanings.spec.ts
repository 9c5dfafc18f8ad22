import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { hcl, lab, rgb } from 'd3-color';
import { describe, expect, it } from 'vitest';
import { BAY_PALETTE, BAY_STATES, BRAND_RAMP, SIGNAL_PALETTE, type BayState } from '@baytime/shared';
import { baytimeDarkTheme, baytimeLightTheme } from './theme';

const ROOT = fileURLToPath(new URL('../../../', import.meta.url));
const APP_SOURCES = ['board/src', 'kiosk/src'];

/**
 * How far (CIE 1976 ΔE*ab) a colour must sit from a bay state's to stay clear of it: our own margin,
 * ten times the just-noticeable difference of about 2.3 (Sharma, "Digital Color Imaging Handbook",
 * 2003, ch. 1; quoted from memory), so a yellow or an orange beside the state's never reads as it.
 */
const CLEAR_OF_STATE = 25;
/** Below this chroma a state colour is a grey (free, ready): only the exact value is taken. */
const GREY_CHROMA = 10;

/** The bay state whose colour this colour is, or reads as; undefined when it is clear of them all. */
export function stateColourOf(colour: string): BayState | undefined {
  const hex = rgb(colour).formatHex().toUpperCase();
  return BAY_STATES.find((state) => {
    const stateColour = BAY_PALETTE[state].colour.toUpperCase();
    if (hcl(stateColour).c < GREY_CHROMA) return hex === stateColour;
    const [a, b] = [lab(hex), lab(stateColour)];
    return Math.hypot(a.l - b.l, a.a - b.a, a.b - b.b) < CLEAR_OF_STATE;
  });
}

const COLOUR_LITERAL = /#[0-9a-f]{6}\b|#[0-9a-f]{3}\b|rgba?\(\s*(\d+)[\s,]+(\d+)[\s,]+(\d+)/gi;

/** The colours written in a text, as hex or as `rgb(r,g,b)` (any alpha dropped). */
function colourLiterals(text: string): string[] {
  return [...text.matchAll(COLOUR_LITERAL)].map(([literal, r, g, b]) =>
    literal.startsWith('#') ? literal : `rgb(${r},${g},${b})`,
  );
}

function sourceFiles(dir: string, pattern: RegExp): string[] {
  return readdirSync(join(ROOT, dir), { recursive: true, encoding: 'utf8' })
    .filter((file) => pattern.test(file) && !file.endsWith('.spec.ts'))
    .map((file) => join(dir, file));
}

interface CssDeclaration {
  file: string;
  selector: string;
  property: string;
  value: string;
}

/** Every declaration of a style sheet with the selector of its innermost rule (comments dropped). */
export function cssDeclarations(file: string, css: string): CssDeclaration[] {
  const declarations: CssDeclaration[] = [];
  const text = css.replace(/\/\*[\s\S]*?\*\//g, '');
  for (const [, selector = '', body = ''] of text.matchAll(/([^{};]+)\{([^{}]*)\}/g)) {
    for (const part of body.split(';')) {
      const colon = part.indexOf(':');
      if (colon < 0) continue;
      declarations.push({
        file,
        selector: selector.trim(),
        property: part.slice(0, colon).trim(),
        value: part.slice(colon + 1).trim(),
      });
    }
  }
  return declarations;
}

/**
 * What a style sheet does wrong with the state colours: a literal that is (or reads as) a state's
 * colour, or a `--bt-state-<state>` used under a rule or property that does not name that state.
 */
export function cssMisuses(declarations: readonly CssDeclaration[]): string[] {
  const misuses: string[] = [];
  for (const { file, selector, property, value } of declarations) {
    const where = `${file}: ${selector} { ${property}: ${value} }`;
    for (const literal of colourLiterals(value)) {
      const state = stateColourOf(literal);
      if (state) misuses.push(`${where} copies the ${state} colour`);
    }
    for (const [, state = ''] of value.matchAll(/var\(--bt-state-([a-z]+)/g)) {
      if (!selector.includes(state) && !property.includes(state))
        misuses.push(`${where} borrows the ${state} colour`);
    }
  }
  return misuses;
}

/** Fluent's palette tokens in the hues the bay states hold (orange, yellow, green, teal, blue, pink). */
const STATE_HUED_TOKENS =
  /colorPalette(DarkOrange|Orange|Marigold|Yellow|Gold|Green|LightGreen|DarkGreen|Forest|Seafoam|Lime|Teal|LightTeal|Blue|RoyalBlue|Cornflower|Steel|Navy|Berry|Pink|Magenta|Lilac|Plum|Peach|Pumpkin|Brown|Anchor)\w*/g;

/**
 * A Fluent badge's `warning` and `success` colours are its yellow and green palettes, the Timer and
 * Working hues: a file that draws badges may not name them (a message bar's `intent` or a field's
 * `validationState` goes through the theme's status tokens, which the test below checks).
 */
function stateHuedBadges(file: string, code: string): string[] {
  if (!code.includes('<Badge')) return [];
  return code
    .split('\n')
    .filter((line) => /['"](warning|success)['"]/.test(line) && !/intent|validationState/.test(line))
    .map((line) => `${file}: ${line.trim()}`);
}

describe(stateColourOf.name, () => {
  it('knows a state colour, one that reads as it, and a grey state only by its exact value', () => {
    expect(stateColourOf(BAY_PALETTE.timer.colour)).toBe('timer');
    expect(stateColourOf('#e7d35a')).toBe('timer');
    expect(stateColourOf('#3ec28f')).toBe('working');
    expect(stateColourOf(BAY_PALETTE.ready.colour.toLowerCase())).toBe('ready');
    expect(stateColourOf('#F4F6F8')).toBeUndefined();
    expect(stateColourOf(SIGNAL_PALETTE.attention.onDark)).toBeUndefined();
  });
});

describe(cssMisuses.name, () => {
  it('finds a copied state colour and a state colour under another name', () => {
    const css = `.wall { --caution: #f0e442; --text: #f4f6f8; }
      .bt-tool--timer svg { color: var(--bt-state-staged); }
      .bt-line--held { --state: var(--bt-state-held); }`;
    expect(cssMisuses(cssDeclarations('x.css', css))).toEqual([
      'x.css: .wall { --caution: #f0e442 } copies the timer colour',
      'x.css: .bt-tool--timer svg { color: var(--bt-state-staged) } borrows the staged colour',
    ]);
  });
});

describe('one meaning per colour', () => {
  it('keeps every signal and brand colour clear of the bay states', () => {
    const colours = [
      ...Object.values(SIGNAL_PALETTE).flatMap((look) => [look.onDark, look.onLight]),
      ...Object.values(BRAND_RAMP),
    ];
    expect(colours.filter((colour) => stateColourOf(colour))).toEqual([]);
  });

  it('uses a state colour in the apps style sheets only for that state', () => {
    const declarations = APP_SOURCES.flatMap((dir) =>
      sourceFiles(dir, /\.css$/).map((file) => cssDeclarations(file, readFileSync(join(ROOT, file), 'utf8'))),
    ).flat();
    expect(declarations.length).toBeGreaterThan(500);
    expect(cssMisuses(declarations)).toEqual([]);
  });

  it('writes no state colour, nor a Fluent token or badge of a state hue, in the apps code', () => {
    const misuses = APP_SOURCES.flatMap((dir) => sourceFiles(dir, /\.tsx?$/)).flatMap((file) => {
      const code = readFileSync(join(ROOT, file), 'utf8');
      const copies = colourLiterals(code)
        .filter((literal) => stateColourOf(literal))
        .map((literal) => `${file}: ${literal} is the ${stateColourOf(literal)} colour`);
      const tokens = [...code.matchAll(STATE_HUED_TOKENS)].map(([token]) => `${file}: ${token}`);
      return [...copies, ...tokens, ...stateHuedBadges(file, code)];
    });
    expect(misuses).toEqual([]);
  });

  it('keeps the office themes warning and success tones clear of the bay states', () => {
    for (const theme of [baytimeLightTheme, baytimeDarkTheme]) {
      const status = Object.entries(theme).filter(([name]) => /^colorStatus(Warning|Success)/.test(name));
      expect(status).toHaveLength(20);
      expect(status.filter(([, colour]) => stateColourOf(String(colour)))).toEqual([]);
    }
  });
});
