// Runs axe-core inside a page and returns the violations at or above a given impact.
import axe from 'axe-core'
import type { Page } from 'playwright-core'

export interface AxeOptions {
  /** Also check WCAG 2.x AAA (enhanced contrast): the shoot screens aim at it. */
  aaa?: boolean
}

export async function axeViolations(page: Page, options: AxeOptions = {}) {
  await page.addScriptTag({ content: axe.source })
  const tags = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa', 'best-practice', ...(options.aaa ? ['wcag2aaa'] : [])]
  const result = await page.evaluate(
    (runOnly) => (window as unknown as { axe: typeof axe }).axe.run(document, { runOnly: { type: 'tag', values: runOnly } }),
    tags,
  )
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical' || (options.aaa && v.id === 'color-contrast-enhanced'))
    .map((v) => ({ id: v.id, impact: v.impact, help: v.help, targets: v.nodes.map((n) => n.target.join(' ')) }))
}
