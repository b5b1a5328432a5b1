import type { Page } from 'playwright-core';

/**
 * Visible selects whose chosen option is cut off: each is compared with a hidden copy of itself
 * holding only that option at its natural width (the browser's own measure, arrow and padding
 * included). Returns "text (needs N px, has M px)" for each one that is too narrow.
 */
export async function clippedSelects(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const out: string[] = [];
    for (const el of Array.from(document.querySelectorAll('select'))) {
      if (!el.checkVisibility()) continue;
      const text = el.selectedOptions[0]?.textContent ?? '';
      const probe = el.cloneNode(false) as HTMLSelectElement;
      const option = document.createElement('option');
      option.textContent = text;
      probe.appendChild(option);
      probe.removeAttribute('id');
      probe.style.cssText = 'position:absolute;visibility:hidden;width:auto;min-width:0;max-width:none;';
      el.parentElement!.appendChild(probe);
      const needs = probe.getBoundingClientRect().width;
      probe.remove();
      const has = el.getBoundingClientRect().width;
      if (needs > has + 0.5) out.push(`${text} (needs ${Math.round(needs)} px, has ${Math.round(has)} px)`);
    }
    return out;
  });
}

/**
 * For each plot label, what a sighted person cannot read of it on the map: text on the plot cut
 * off, or its label or status word (the word its accessible name gives after the label) shown
 * neither on the plot nor in the map's "Too small to label" key. Empty when everything reads.
 */
export async function unreadablePlots(page: Page, labels: string[]): Promise<string[]> {
  return page.evaluate((wanted) => {
    const problems: string[] = [];
    const key = Array.from(document.querySelectorAll('p')).find((p) => p.textContent?.startsWith('Too small to label'));
    const keyText = key && key.checkVisibility() ? (key.textContent ?? '') : '';
    for (const label of wanted) {
      const tile = document.querySelector<HTMLElement>(`[data-plot-label="${CSS.escape(label)}"]`);
      if (!tile) {
        problems.push(`${label}: not on the map`);
        continue;
      }
      const name = tile.getAttribute('aria-label') ?? '';
      const word = name.slice(`Plot ${label} `.length).split(',')[0] ?? '';
      const box = tile.getBoundingClientRect();
      for (const span of Array.from(tile.querySelectorAll<HTMLElement>('span'))) {
        if (!span.textContent?.trim()) continue;
        const r = span.getBoundingClientRect();
        const cut = span.scrollWidth > span.clientWidth + 1 || r.left < box.left - 1 || r.right > box.right + 1 || r.top < box.top - 1 || r.bottom > box.bottom + 1;
        if (cut) problems.push(`${label}: "${span.textContent}" is cut off`);
      }
      const onTile = tile.innerText.replace(/\s+/g, ' ').trim();
      const shown = (text: string) => onTile.split(' ').includes(text) || onTile === text;
      const inKey = keyText.includes(word ? `${label} ${word}` : label);
      if (!(shown(label) && (!word || shown(word))) && !inKey) problems.push(`${label}: shows "${onTile}", not "${label} ${word}"`);
    }
    return problems;
  }, labels);
}
