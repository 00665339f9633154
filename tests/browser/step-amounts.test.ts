// Amounts in a step's text, in real Chromium: the demo producer opens a demo recipe's editor, puts the
// olive oil into a step from "Insert amount" by keyboard, reads the step as the prompter will (the demo
// studio is metric: 2 tbsp = 29.57 mL by NIST Handbook 44 Appendix C, 1 tbsp = 14.78676478125 mL,
// shown to 5 mL steps as 30 mL), sees an amount that names no ingredient said in plain words, saves,
// and finds it kept after a reload and read the same by the server's renderer.
import { resolve } from 'node:path'
import { createPage, url } from '@nuxt/test-utils/e2e'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { axeViolations } from '../support/axe'
import { chromiumAvailable } from '../support/chromium'
import { artifactsDir, consoleErrorsOf, screenshot, signInOnPage } from '../support/page'

const STEW = 'Smoky butter bean and tomato stew'

describe.skipIf(!chromiumAvailable())('amounts in step text, in the browser', async () => {
  await useBuiltApp({ browser: true })

  it('Insert amount puts the olive oil at the cursor; the preview reads 30 mL olive oil; saved and kept', async () => {
    const page = await createPage(undefined, { viewport: { width: 1280, height: 900 } })
    const errors = consoleErrorsOf(page)
    await signInOnPage(page, 'producer@brackenford.test')
    const me = await (await page.request.get(url('/api/me'))).json()
    const studioId: number = me.memberships[0].studioId
    const list = await (await page.request.get(url(`/api/studios/${studioId}/recipes`))).json()
    const recipeId: number = list.recipes.find((r: { title: string }) => r.title === STEW).id
    const recipe = await (await page.request.get(url(`/api/recipes/${recipeId}`))).json()
    const last: number = recipe.steps.length
    const before: string = recipe.steps[last - 1].text

    await page.goto(url(`/recipes/${recipeId}/edit`), { waitUntil: 'networkidle' })
    const card = page.getByTestId(`step-card-${last}`)
    const text = card.getByLabel('What to do')
    await text.waitFor()
    // No notation on screen: the ingredient table and the steps' help speak of amounts, not of their stored form.
    const words = await page.getByRole('form', { name: 'Recipe' }).evaluate((form) => {
      const copy = form.cloneNode(true) as HTMLElement
      copy.querySelectorAll('textarea, input, select').forEach((el) => el.remove())
      return copy.textContent ?? ''
    })
    expect(words).toContain('Insert amount')
    expect(words).not.toMatch(/\{\{|\}\}/)
    // "Waits for" names the earlier steps with their amounts as words: "Chop onion finely…".
    await card.getByText(/^\s*Step 1: Chop onion finely/).waitFor()

    // The cursor at the end of the text, a few words typed, then the picker by keyboard.
    await text.click()
    await text.press('Control+End')
    await text.pressSequentially(' Finish with')
    const picker = card.getByTestId(`amount-picker-${last}`)
    const options = await picker.getByLabel('Ingredient', { exact: true }).locator('option').allTextContents()
    expect(options).toEqual(recipe.ingredients.map((i: { item: string }) => i.item))
    await picker.getByLabel('Ingredient', { exact: true }).selectOption({ label: 'olive oil' })
    expect(await picker.getByLabel('Reads as').inputValue()).toBe('item')
    expect(await picker.getByLabel('How much').inputValue()).toBe('1')
    await picker.getByRole('button', { name: `Insert in step ${last}` }).focus()
    await page.keyboard.press('Enter')

    // Stored in the form the prompter scales; the cursor is back in the text, just after it.
    const stored = `${before} Finish with {{olive-oil|item}}`
    await expect.poll(() => text.inputValue()).toBe(stored)
    const cursor = await text.evaluate((el: HTMLTextAreaElement) => [document.activeElement === el, el.selectionStart, el.selectionEnd])
    expect(cursor).toEqual([true, stored.length, stored.length])
    await page.keyboard.type('.')
    expect(await text.inputValue()).toBe(`${stored}.`)

    // The preview reads the amount as the prompter will: the recipe's 4 servings, the studio's metric units.
    const preview = card.getByTestId(`step-preview-${last}`)
    await expect.poll(() => preview.getByTestId('step-preview-text').textContent()).toBe(`${before} Finish with 30 mL olive oil.`)
    await expect(preview.textContent()).resolves.toContain('On the prompter (4 servings, metric)')
    expect(await preview.locator('strong').getAttribute('title')).toMatch(/^exactly 29\.57 mL; converted from 2 tbsp$/)

    // Half of it, amount only, at a cursor put before the full stop.
    await text.evaluate((el: HTMLTextAreaElement) => el.setSelectionRange(el.value.length - 1, el.value.length - 1))
    await picker.getByLabel('Reads as').selectOption({ label: 'Amount only' })
    await picker.getByLabel('How much').selectOption({ label: 'Half' })
    await picker.getByRole('button', { name: `Insert in step ${last}` }).click()
    await expect.poll(() => text.inputValue()).toBe(`${stored} {{olive-oil*1/2}}.`)
    // half of 29.57 mL is 14.79 mL: under 15 mL a spoon measure, 1 tbsp
    await expect.poll(() => preview.getByTestId('step-preview-text').textContent()).toBe(`${before} Finish with 30 mL olive oil 1 tbsp.`)

    // An amount that names no ingredient (pasted from elsewhere) is said in plain words, and the box is marked.
    await text.fill(`${before} Add {{lemon-zest|item}}.`)
    await preview.getByText('This step mentions an ingredient that is not in the list: “lemon zest”; pick it again from Insert amount.').waitFor()
    expect(await preview.getByTestId('step-preview-text').textContent()).toBe(`${before} Add lemon zest.`)
    expect(await text.getAttribute('aria-invalid')).toBe('true')
    await card.screenshot({ path: resolve(artifactsDir, 'step-amounts-unknown.png') })
    await text.fill(`${before} Finish with {{olive-oil|item}}.`)
    await expect.poll(() => preview.getByText('not in the list').count()).toBe(0)
    expect(await text.getAttribute('aria-invalid')).toBeNull()

    // At the foot of the form, where the sticky save bar covers no field (elsewhere it may half cover a checkbox under it).
    await page.evaluate(() => window.scrollTo(0, document.body.scrollHeight))
    expect(await axeViolations(page)).toEqual([])
    await screenshot(page, 'step-amounts-editor')
    await card.screenshot({ path: resolve(artifactsDir, 'step-amounts-card.png') })

    await page.getByRole('button', { name: 'Save recipe' }).click()
    await page.getByText(/^Saved at .*\(version \d+\)\.$/).waitFor()
    await page.getByText('All changes saved.').waitFor()

    // Kept after a reload, and the server's renderer (the prompter's) reads the same words.
    await page.reload({ waitUntil: 'networkidle' })
    await expect.poll(() => page.getByTestId(`step-card-${last}`).getByLabel('What to do').inputValue()).toBe(`${before} Finish with {{olive-oil|item}}.`)
    const shown = await page.getByTestId(`step-preview-${last}`).getByTestId('step-preview-text').textContent()
    expect(shown).toBe(`${before} Finish with 30 mL olive oil.`)
    const scaled = await (await page.request.get(url(`/api/recipes/${recipeId}/scaled`))).json()
    expect(scaled.steps[last - 1].text).toBe(shown)
    expect(errors).toEqual([])
  })
})
