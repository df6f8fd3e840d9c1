import { createRequire } from 'node:module';
import { expect } from 'vitest';
import type { Page } from 'playwright-core';

// axe-core from node_modules, injected into the page (nothing fetched at run time). The rules are
// those tagged for WCAG 2.0 A and AA and WCAG 2.1 AA (Deque, axe-core API documentation, runOnly tags).
const AXE_SCRIPT = createRequire(import.meta.url).resolve('axe-core/axe.min.js');
export const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21aa'] as const;

interface AxeNode {
  target: unknown[];
  html: string;
  failureSummary?: string;
}
interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: AxeNode[];
}

/**
 * Runs axe on the page as it is now. The app's content security policy allows no inline script,
 * so the page's context must be made with `bypassCSP: true` for the script tag to run.
 */
/* Runs axe on the page as it is now and returns its violations, one printable line per element. */
export async function axeViolations(page: Page): Promise<{ count: number; lines: string[] }> {
  if (!(await page.evaluate(() => 'axe' in window))) await page.addScriptTag({ path: AXE_SCRIPT });
  const violations = (await page.evaluate(
    async (tags) => {
      const axe = (window as unknown as { axe: { run: (ctx: Document, opts: object) => Promise<{ violations: unknown[] }> } }).axe;
      const result = await axe.run(document, { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] });
      return result.violations;
    },
    [...WCAG_TAGS],
  )) as AxeViolation[];
  const lines: string[] = [];
  for (const v of violations) {
    for (const n of v.nodes) {
      lines.push(`${v.id} [${v.impact ?? 'n/a'}] ${n.target.map(String).join(' > ')}: ${n.html.replace(/\s+/g, ' ').slice(0, 160)} (${v.help})`);
    }
  }
  return { count: violations.length, lines };
}

/** Fails the test on any WCAG 2.1 A/AA violation, naming each with its rule, impact, selector and HTML. */
export async function expectNoAxeViolations(page: Page, label: string): Promise<void> {
  const { lines } = await axeViolations(page);
  expect(lines, `axe (WCAG 2.1 A/AA) on ${label}:\n${lines.join('\n')}`).toEqual([]);
}

/** Buttons and links without an accessible name (axe covers names too; this says it in plain words). */
export async function namelessControls(page: Page): Promise<string[]> {
  const out: string[] = [];
  for (const role of ['button', 'link'] as const) {
    for (const el of await page.getByRole(role).all()) {
      if (!(await el.isVisible())) continue;
      const name = await el.evaluate(
        (e) =>
          (e.getAttribute('aria-label') ?? e.getAttribute('title') ?? (e as HTMLElement).innerText ?? '').trim() ||
          (e.getAttribute('aria-labelledby') ? (document.getElementById(e.getAttribute('aria-labelledby')!)?.textContent?.trim() ?? '') : ''),
      );
      if (!name) out.push(`${role}: ${(await el.evaluate((e) => e.outerHTML)).slice(0, 160)}`);
    }
  }
  return out;
}

/** Visible buttons, links and inputs-as-buttons smaller than min x min CSS pixels. */
export async function smallTargets(page: Page, min = 44): Promise<string[]> {
  const out: string[] = [];
  for (const el of await page.locator('button, a[href], [role="button"], input[type="checkbox"], input[type="radio"], select').all()) {
    if (!(await el.isVisible())) continue;
    const box = await el.boundingBox();
    if (!box) continue;
    if (box.width < min - 0.5 || box.height < min - 0.5)
      out.push(`${Math.round(box.width)}x${Math.round(box.height)}: ${(await el.evaluate((e) => e.outerHTML)).replace(/\s+/g, ' ').slice(0, 140)}`);
  }
  return out;
}

/** Presses Tab n times and reports the focused element's computed outline each time. */
export async function focusOutlines(page: Page, presses: number): Promise<{ element: string; outline: string; visible: boolean }[]> {
  await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
  const out: { element: string; outline: string; visible: boolean }[] = [];
  for (let i = 0; i < presses; i++) {
    await page.keyboard.press('Tab');
    out.push(
      await page.evaluate(() => {
        const e = document.activeElement as HTMLElement | null;
        if (!e || e === document.body) return { element: 'body', outline: 'none', visible: true };
        const s = getComputedStyle(e);
        const width = parseFloat(s.outlineWidth);
        return {
          element: e.outerHTML.slice(0, 100),
          outline: `${s.outlineStyle} ${s.outlineWidth} ${s.outlineColor}`,
          visible: e.matches(':focus-visible') && s.outlineStyle !== 'none' && width >= 2,
        };
      }),
    );
  }
  return out.filter((o) => o.element !== 'body');
}
