import type { Page } from 'playwright-core';

export interface Flaw {
  what: 'cut' | 'clipped' | 'sticks out';
  element: string;
  text: string;
}

/**
 * Every visible text that is cut (wider than its box with overflow hidden or an ellipsis, or clamped),
 * or hidden past the edge of a box that clips it, and everything that sticks out of the viewport
 * sideways. Deliberately tiny boxes (screen-reader-only text) and hidden measuring copies are skipped,
 * and text the page shortens on purpose (`data-shortened`: a wall tile's long model) may end in an
 * ellipsis.
 */
export async function flaws(page: Page): Promise<Flaw[]> {
  return page.evaluate(() => {
    const found: { what: 'cut' | 'clipped' | 'sticks out'; element: string; text: string }[] = [];
    const name = (el: Element) =>
      `${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ''}.${[...el.classList].join('.')}`;
    // Tiny itself, or inside a tiny box that clips: a box of no height that lets its content show
    // (the wall's root, under a fixed-position board) hides nothing.
    const tiny = (el: Element) => {
      for (let at: Element | null = el; at; at = at.parentElement) {
        const box = at.getBoundingClientRect();
        const clips = at === el || getComputedStyle(at).overflow !== 'visible';
        if (clips && (box.width <= 2 || box.height <= 2)) return true;
      }
      return false;
    };
    for (const el of document.querySelectorAll('body *')) {
      const style = getComputedStyle(el);
      if (style.display === 'none' || style.visibility === 'hidden' || el.closest('[aria-hidden="true"]'))
        continue;
      const box = el.getBoundingClientRect();
      if (box.width === 0 || box.height === 0 || tiny(el)) continue;
      const text = [...el.childNodes]
        .filter((node) => node.nodeType === Node.TEXT_NODE)
        .map((node) => node.textContent ?? '')
        .join('')
        .trim();
      if (text) {
        const widthCut = el.scrollWidth > el.clientWidth + 1 && style.overflowX !== 'visible';
        const clamped = style.webkitLineClamp !== 'none' && el.scrollHeight > el.clientHeight + 1;
        const shortened = el.closest('[data-shortened]') !== null;
        if ((widthCut || clamped) && !shortened) found.push({ what: 'cut', element: name(el), text });
        // A box that clips (hidden, not scrollable) and the text past its edge. A line box may hang
        // past it by the font's empty space above the caps and below the descenders, which a tight
        // line height leaves outside (the wall's bay names): 0.3 em, Barlow's ascent less its caps.
        const hangs = 0.3 * parseFloat(style.fontSize);
        for (let up = el.parentElement; up && up !== document.body; up = up.parentElement) {
          const clip = getComputedStyle(up);
          const hidesX = clip.overflowX === 'hidden' || clip.overflowX === 'clip';
          const hidesY = clip.overflowY === 'hidden' || clip.overflowY === 'clip';
          if (!hidesX && !hidesY) continue;
          const edge = up.getBoundingClientRect();
          const pastX = hidesX && (box.left < edge.left - 1 || box.right > edge.right + 1);
          const pastY = hidesY && (box.top < edge.top - hangs || box.bottom > edge.bottom + hangs);
          if (pastX || pastY) found.push({ what: 'clipped', element: name(el), text });
          break;
        }
      }
      const scrolls = (() => {
        for (let up = el.parentElement; up; up = up.parentElement)
          if (getComputedStyle(up).overflowX !== 'visible') return true;
        return false;
      })();
      if (!scrolls && (box.right > innerWidth + 1 || box.left < -1))
        found.push({ what: 'sticks out', element: name(el), text: (el.textContent ?? '').slice(0, 40) });
    }
    if (document.documentElement.scrollWidth > innerWidth)
      found.push({
        what: 'sticks out',
        element: 'html',
        text: `${document.documentElement.scrollWidth}px wide`,
      });
    return found;
  });
}
