// The episode's shopping list (shared/utils/shopping-list.ts) over stored recipes and prices, and the
// crew's check-offs (table shopping_checks, migration 0014). Devices see each other's ticks by polling
// the list (pages/episodes/[id]/shopping.vue, every 2 s); `version` changes with every tick or untick.
import { QueryTypes } from 'sequelize'
import { stringify } from 'csv-stringify/sync'
import type { User } from '#auth-utils'
import { DomainError } from '../../shared/utils/domain-error'
import { buildShoppingList, type ShoppingRecipe } from '../../shared/utils/shopping-list'
import { SHOP_SECTION_LABELS } from '../../shared/utils/shop-sections'
import { greatest } from '../db/dialect'

/** A line key as the list makes them: lower-case letters, digits and hyphens. */
export const LINE_KEY = /^[a-z0-9](?:[a-z0-9-]{0,78}[a-z0-9])?$/

type CheckRow = { line_key: string; ticked: number; ticked_by_name: string | null; at: number }

async function checksOf(episodeId: number) {
  const db = await useDb()
  const rows = await db.query<CheckRow>('SELECT line_key, ticked, ticked_by_name, at FROM shopping_checks WHERE episode_id = ?', {
    replacements: [episodeId], type: QueryTypes.SELECT,
  })
  return rows
}

/** The list's data without the check-offs: what the recipes need at the shoot's servings. */
export async function episodeShopping(episodeId: number, studioId: number) {
  const episode = await loadEpisode(episodeId)
  if (!episode) throw new DomainError('not-found', 'There is no such episode.')
  const settings = await studioSettings(studioId)
  const prices = await pricesFor(studioId)
  const recipes: ShoppingRecipe[] = []
  for (const s of episode.segments) {
    if (!s.recipeId) continue
    const r = await loadRecipe(s.recipeId)
    if (r) recipes.push({ recipeId: r.id, title: r.title, servings: r.servings, ingredients: r.ingredients.map((i) => ({ ...i, priceId: i.priceId ?? null })) })
  }
  const list = buildShoppingList(recipes, { servings: episode.servings, prices, currency: settings.currency })
  return { episode, settings, list }
}

/** The list with who ticked what, money formatted in the studio's locale, and the version devices compare. */
export async function shoppingView(episodeId: number, studioId: number) {
  const { episode, settings, list } = await episodeShopping(episodeId, studioId)
  const rows = await checksOf(episodeId)
  const byKey = new Map(rows.map((r) => [r.line_key, r]))
  const fmt = (minor: number | null) => (minor === null ? null : formatMoney(minor, list.currency, settings.locale))
  return {
    episode: { id: episode.id, title: episode.title, servings: episode.servings, shootDate: episode.shootDate },
    currency: list.currency,
    version: `${rows.reduce((m, r) => Math.max(m, Number(r.at)), 0)}-${rows.filter((r) => r.ticked).length}`,
    sections: list.sections,
    lines: list.lines.map((l) => {
      const c = byKey.get(l.key)
      return {
        ...l,
        sectionLabel: SHOP_SECTION_LABELS[l.section],
        basket: fmt(l.basketMinor),
        used: fmt(l.usedMinor),
        check: c && c.ticked ? { by: c.ticked_by_name, at: new Date(Number(c.at)).toISOString() } : null,
      }
    }),
    totals: {
      ...list.totals,
      basket: fmt(list.totals.basketMinor)!, basketRequired: fmt(list.totals.basketRequiredMinor)!,
      used: fmt(list.totals.usedMinor)!, usedRequired: fmt(list.totals.usedRequiredMinor)!,
    },
  }
}

/** Tick or untick one line for the whole crew; a key the list does not have is refused. */
export async function setShoppingCheck(episodeId: number, studioId: number, key: string, ticked: boolean, user: User) {
  if (!LINE_KEY.test(key)) {
    throw new DomainError('invalid', 'Shopping list line: this address names no line of the list; open the shopping list again and tick from there.', { field: 'key' })
  }
  const { list } = await episodeShopping(episodeId, studioId)
  if (!list.lines.some((l) => l.key === key)) {
    throw new DomainError('not-found', 'There is no such line on this shopping list; the recipes may have changed. Open the list again.')
  }
  const db = await useDb()
  await db.query(
    `INSERT INTO shopping_checks (episode_id, line_key, ticked, ticked_by, ticked_by_name, at) VALUES (?, ?, ?, ?, ?, ?)
     ON CONFLICT (episode_id, line_key) DO UPDATE SET ticked = excluded.ticked, ticked_by = excluded.ticked_by,
     ticked_by_name = excluded.ticked_by_name, at = ${greatest(db, 'excluded.at', 'shopping_checks.at + 1')}`,
    { replacements: [episodeId, key, ticked, user.id, user.name, Date.now()] },
  )
  return shoppingView(episodeId, studioId)
}

/** The list as CSV (RFC 4180, a header row), for a spreadsheet or a printer. */
export async function shoppingCsv(episodeId: number, studioId: number) {
  const view = await shoppingView(episodeId, studioId)
  const header = ['Section', 'Item', 'Amount', 'Optional', 'To taste', 'Buy', 'Shop', 'Basket', 'Used', 'Left over', 'Ticked by', 'Notes']
  const rows = view.lines.map((l) => [
    l.sectionLabel, l.item, l.text, l.optional ? 'yes' : 'no', l.toTaste ? 'yes' : 'no', l.packages?.text ?? '', l.price?.shop ?? '',
    l.basket ?? '', l.used ?? '', l.leftover?.text ?? '', l.check?.by ?? '', [...l.notes, ...(l.packageNote ? [l.packageNote] : [])].join('; '),
  ])
  rows.push(['', 'Total', '', '', '', '', '', view.totals.basket, view.totals.used, '', '', ''])
  return { csv: stringify([header, ...rows]), title: view.episode.title }
}
