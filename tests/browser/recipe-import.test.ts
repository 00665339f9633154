// An imported page's step times, read from the step text, appear as suggestions in the import
// preview; one confirmed there is saved as confirmed, the others stay marked in the editor until
// confirmed there, and the cook plan lists the steps with no time and those still unconfirmed,
// planning each read time at the long end of its range — in real Chromium.
import { createPage, url } from '@nuxt/test-utils/e2e'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { chromiumAvailable } from '../support/chromium'
import { consoleErrorsOf, sameOrigin, screenshot, signInOnPage } from '../support/page'

const PAGE = JSON.stringify({
  '@context': 'https://schema.org', '@type': 'Recipe', name: 'Brackenford lemon drizzle', recipeYield: '8',
  recipeIngredient: ['1 ½ cups (190 g) self-raising flour', '¾ cup (150 g) caster sugar', '2 and a half tablespoons lemon juice', 'half a dozen eggs'],
  recipeInstructions: [
    'Preheat the oven to 180°C.',
    'Beat the butter and sugar for 3-4 minutes until pale.',
    'Bake for 40 to 45 minutes, until a skewer comes out clean.',
    'Leave to cool in the tin for at least 1 hour.',
    'Drizzle with the lemon syrup.',
  ],
})

describe.skipIf(!chromiumAvailable())('recipe import in the browser', async () => {
  await useBuiltApp({ browser: true })

  it('import preview → confirm one step → editor marks the rest → the plan lists the steps to check', async () => {
    const page = await createPage(undefined, { viewport: { width: 1280, height: 900 } })
    const errors = consoleErrorsOf(page)
    await signInOnPage(page, 'producer@brackenford.test')
    const studioPath = new URL(page.url()).pathname

    await page.goto(url(`${studioPath}/recipes/import`), { waitUntil: 'networkidle' })
    await page.getByLabel('Paste JSON-LD or HTML').fill(PAGE)
    await page.getByRole('button', { name: 'Read it' }).click()
    const bake = page.getByTestId('import-step-reading-3')
    await bake.waitFor()
    expect(await bake.innerText()).toMatch(/read from the text\s+40–45 min, a wait \(hands-off\), at the oven/)
    expect(await page.getByTestId('import-step-reading-2').innerText()).toMatch(/3–4 min/)
    expect(await page.getByTestId('import-step-reading-4').innerText()).toMatch(/1 h.*a wait/)
    // the amounts as written, the stated grams kept beside the cups, half a dozen as six
    const lines = await page.getByTestId('import-ingredients').innerText()
    expect(lines).toContain('1½ cups (190 g) self-raising flour')
    expect(lines).toContain('2½ tbsp lemon juice')
    expect(lines).toMatch(/^6 eggs/m)
    await page.getByTestId('import-confirm-3').check()
    await screenshot(page, 'import-preview-step-times')

    await page.getByRole('button', { name: 'Save this recipe' }).click()
    await page.waitForURL(/\/recipes\/\d+$/)
    const recipeId = Number(new URL(page.url()).pathname.split('/').at(-1))
    const saved = await (await page.request.get(url(`/api/recipes/${recipeId}`))).json()
    type Step = { durationMin: number | null; durationMax: number | null; readFromText: string[] }
    expect(saved.steps.map((s: Step) => [s.durationMin, s.durationMax, s.readFromText])).toEqual([
      [null, null, ['station']], [180, 240, ['duration']], [2400, 2700, []], [3600, 3600, ['duration', 'handsOn']], [null, null, []],
    ])

    // the editor marks what is still read from the text, and Confirm clears the mark
    await page.goto(url(`/recipes/${recipeId}/edit`), { waitUntil: 'networkidle' })
    await page.getByTestId('step-read-4').waitFor()
    expect(await page.getByTestId('step-read-3').count()).toBe(0)
    expect(await page.getByTestId('step-read-4').innerText()).toContain('duration, kind (wait)')
    expect(await page.getByTestId('stated-1').innerText()).toContain('190 g')
    await page.getByTestId('step-read-confirm-4').click()
    expect(await page.getByTestId('step-read-4').count()).toBe(0)

    // the plan: step 3's 40–45 minutes planned at 45, and the steps to check named
    const episode = await page.request.post(url(`/api/studios/${studioPath.split('/').at(-1)}/episodes`), {
      data: { title: 'Drizzle day', recipeIds: [recipeId] }, headers: sameOrigin(),
    })
    expect(episode.status()).toBe(201)
    const episodeId = (await episode.json()).id
    const plan = await (await page.request.get(url(`/api/episodes/${episodeId}/plan`))).json()
    const bakeStep = plan.steps.find((s: { label: string }) => s.label.startsWith('Bake'))
    expect(bakeStep.end - bakeStep.start).toBe(2700)
    await page.goto(url(`/episodes/${episodeId}/plan`), { waitUntil: 'networkidle' })
    const needsTime = await page.getByTestId('plan-needs-time').innerText()
    expect(needsTime).toContain('Preheat the oven to 180°C')
    expect(needsTime).toContain('Drizzle with the lemon syrup')
    expect(await page.getByTestId('plan-read-from-text').innerText()).toMatch(/Beat the butter and sugar.*\(time read from the text\)/)
    await screenshot(page, 'plan-steps-to-check')
    expect(errors).toEqual([])
  })
})
