// Allergen certainty and the studio's pint, in real Chromium (issue 14): a recipe with one checked and
// one suggested ingredient shows the difference on the recipe page and on the prompter, and "Free of"
// treats it as unchecked; a UK studio (en-GB) reads "1 pint" as the imperial pint, 568.26125 mL by the
// Weights and Measures Act 1985, shown as 570 mL with the fluid measures in force named on the page.
import { createPage, url } from '@nuxt/test-utils/e2e'
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { chromiumAvailable } from '../support/chromium'
import { consoleErrorsOf, DEMO_PASSWORD, sameOrigin, screenshot } from '../support/page'

async function signedIn(email: string, viewport = { width: 1280, height: 900 }): Promise<{ page: Page; errors: string[] }> {
  const page = await createPage(undefined, { viewport })
  const errors = consoleErrorsOf(page)
  expect((await page.request.post(url('/api/auth/login'), { data: { email, password: DEMO_PASSWORD }, headers: sameOrigin() })).status()).toBe(200)
  return { page, errors }
}

describe.skipIf(!chromiumAvailable())('kitchen facts in the browser', async () => {
  await useBuiltApp({ browser: true })

  it('checked beside suggested on the recipe page, the list and the prompter; a UK pint is 568 mL', async () => {
    const { page, errors } = await signedIn('producer@brackenford.test')
    const me = await (await page.request.get(url('/api/me'))).json()
    const studioId: number = me.memberships[0].studioId
    const list = await (await page.request.get(url(`/api/studios/${studioId}/recipes`))).json()
    const flatbreadsId: number = list.recipes.find((r: { title: string }) => r.title === 'Pan flatbreads with mint yoghurt').id

    // The flour's label is checked; the yoghurt's allergens stay suggested from its name.
    const recipe = await (await page.request.get(url(`/api/recipes/${flatbreadsId}`))).json()
    const body = {
      ...recipe,
      ingredients: recipe.ingredients.map((i: { item: string }) => (/flour/.test(i.item) ? { ...i, allergenState: 'checked' } : i)),
      steps: recipe.steps.map((s: object) => ({ ...s, photo: undefined })),
    }
    const saved = await page.request.patch(url(`/api/recipes/${flatbreadsId}`), { data: body, headers: sameOrigin() })
    expect(saved.status()).toBe(200)

    await page.goto(url(`/recipes/${flatbreadsId}`), { waitUntil: 'networkidle' })
    const panel = page.getByTestId('allergen-panel')
    await panel.waitFor()
    const euMilk = panel.locator('li', { hasText: 'plain yoghurt' }).first()
    await expect(euMilk.getByTestId('allergen-suggested').textContent()).resolves.toBe('suggested, not checked')
    const euGluten = panel.locator('li', { hasText: 'self-raising flour' }).first()
    await expect(euGluten.getByTestId('allergen-checked').first().textContent()).resolves.toBe('checked')
    await expect(panel.getByTestId('allergen-certainty').textContent()).resolves.toMatch(/self-raising flour: checked by [^,]+ on \d+ \w+ \d{4}/)
    await expect(panel.getByTestId('allergen-unchecked').textContent()).resolves.toMatch(/plain yoghurt/)
    await screenshot(page, 'recipe-allergen-certainty')

    // "Free of peanuts": the flatbreads list no peanuts but have unchecked ingredients, so they are left out and named.
    await page.goto(url(`/studios/${studioId}/recipes?without=peanuts`), { waitUntil: 'networkidle' })
    const leftOut = page.getByTestId('free-of-unchecked')
    await leftOut.waitFor()
    await expect(leftOut.textContent()).resolves.toMatch(/Pan flatbreads with mint yoghurt: \d+ unchecked ingredients?/)
    expect(await page.locator('[data-testid^="recipe-row-"]', { hasText: 'Pan flatbreads' }).count()).toBe(0)

    // A UK studio: "1 pint whole milk" is an imperial pint.
    const ld = JSON.stringify({ '@context': 'https://schema.org', '@type': 'Recipe', name: 'Milk jelly', recipeYield: '4', recipeIngredient: ['1 pint whole milk'] })
    const imported = await page.request.post(url(`/api/studios/${studioId}/recipes/import`), {
      data: ld, headers: { ...sameOrigin(), 'content-type': 'application/ld+json' },
    })
    expect(imported.status()).toBe(201)
    const jellyId: number = (await imported.json()).recipe.id
    await page.goto(url(`/recipes/${jellyId}`), { waitUntil: 'networkidle' })
    await expect(page.getByTestId('fluid-in-force').textContent()).resolves.toMatch(/Imperial fluid measures: 1 pint = 568 mL/)
    await expect(page.getByText('570 mL').first().isVisible()).resolves.toBe(true)
    await screenshot(page, 'recipe-uk-pint')

    // The prompter, at the flour-and-yoghurt step: the allergen caution names the unchecked yoghurt.
    const created = await page.request.post(url('/api/episodes/1/shoots'), { data: { mode: 'rehearsal' }, headers: sameOrigin() })
    expect(created.status()).toBe(201)
    const shootId: number = (await created.json()).shoot.id
    const host = await signedIn('host@brackenford.test')
    await host.page.goto(url(`/shoots/${shootId}/prompter`), { waitUntil: 'networkidle' })
    await host.page.locator('[data-testid="connection"][data-online="true"]').waitFor()
    expect((await page.request.post(url(`/api/shoots/${shootId}/commands`), { data: { type: 'shoot.start' }, headers: sameOrigin() })).status()).toBe(200)
    const runOrder: Array<{ stepIds: number[] }> = (await (await page.request.get(url(`/api/shoots/${shootId}`))).json()).state.runOrder
    const doughStepId: number = recipe.steps[0].id
    const segment = runOrder.findIndex((s) => s.stepIds.map(Number).includes(doughStepId))
    const step = runOrder[segment]!.stepIds.map(Number).indexOf(doughStepId)
    const jump = await page.request.post(url(`/api/shoots/${shootId}/commands`), { data: { type: 'step.jump', segment, step }, headers: sameOrigin() })
    expect(jump.status(), await jump.text()).toBe(200)
    const allergen = host.page.locator('[data-testid="prompter-cautions"] [data-caution="allergen"]')
    await allergen.waitFor()
    await expect(allergen.getByTestId('prompter-allergens-unchecked').textContent()).resolves.toMatch(/Not checked: plain yoghurt/)
    await expect(allergen.textContent()).resolves.not.toMatch(/Not checked:[^.]*flour/)
    await expect(allergen.textContent()).resolves.toMatch(/Follow your local food-safety rules\./)
    await screenshot(host.page, 'prompter-allergen-certainty')

    // The cue screen and the desk show the step's caution labels.
    const camera = await signedIn('camera@brackenford.test', { width: 900, height: 1000 })
    await camera.page.goto(url(`/shoots/${shootId}/cue`), { waitUntil: 'networkidle' })
    await expect(camera.page.getByTestId('caution-labels').textContent()).resolves.toContain('Allergens')
    await page.goto(url(`/shoots/${shootId}/desk`), { waitUntil: 'networkidle' })
    await expect(page.getByTestId('caution-labels').textContent()).resolves.toContain('Allergens')
    expect(camera.errors).toEqual([])
    expect(errors).toEqual([])
    expect(host.errors).toEqual([])
  })
})
