// The studio's price list, and reading an uploaded text file (CSV or JSON-LD).
import type { H3Event } from 'h3'
import type { z } from 'zod'
import { Price, Studio } from '../db/models'
import type { StudioPrice } from '../../shared/utils/cost'
import type { UnitId } from '../../shared/utils/units'
import type { priceBodySchema } from '../../shared/utils/recipe-schemas'
import { DomainError } from '../../shared/utils/domain-error'
import { fieldLabel } from '../../shared/utils/field-labels'

type PriceBody = z.output<typeof priceBodySchema>

export function priceView(p: Price) {
  return {
    id: p.id, item: p.item, packageSize: p.packageSize, packageUnit: p.packageUnit,
    priceMinor: p.priceMinor, currency: p.currency, shop: p.shop, boughtOn: p.boughtOn,
  }
}

/** As the costing core wants it: ids as strings, "each" as a null unit. */
export function studioPrice(p: ReturnType<typeof priceView>): StudioPrice {
  return { id: String(p.id), item: p.item, packageSize: p.packageSize, packageUnit: p.packageUnit === 'each' ? null : (p.packageUnit as UnitId), priceMinor: p.priceMinor, currency: p.currency, shop: p.shop, date: p.boughtOn }
}

export async function listPrices(studioId: number) {
  await useDb()
  return (await Price.findAll({ where: { studioId }, order: [['item', 'ASC'], ['id', 'ASC']] })).map(priceView)
}

export async function createPrice(studioId: number, body: PriceBody) {
  await useDb()
  return priceView(await Price.create({ studioId, ...body, shop: body.shop ?? null, boughtOn: body.boughtOn ?? null }))
}

async function ownPrice(studioId: number, priceId: number) {
  await useDb()
  const price = await Price.findOne({ where: { id: priceId, studioId } })
  if (!price) throw new DomainError('not-found', 'There is no such price in this studio.')
  return price
}

export async function updatePrice(studioId: number, priceId: number, body: PriceBody) {
  const price = await ownPrice(studioId, priceId)
  await price.update({ ...body, shop: body.shop ?? null, boughtOn: body.boughtOn ?? null })
  return priceView(price)
}

export async function deletePrice(studioId: number, priceId: number) {
  await (await ownPrice(studioId, priceId)).destroy()
}

/** An ingredient may only be costed with a price of its own studio. */
export async function assertPricesInStudio(studioId: number, ingredients: { priceId?: number | null }[]) {
  const ids = [...new Set(ingredients.map((i) => i.priceId).filter((x): x is number => !!x))]
  if (!ids.length) return
  const found = new Set((await Price.findAll({ where: { id: ids, studioId }, attributes: ['id'] })).map((p) => p.id))
  const at = ingredients.findIndex((i) => !!i.priceId && !found.has(i.priceId))
  if (at >= 0) {
    const field = `ingredients.${at}.priceId`
    throw new DomainError('invalid', `${fieldLabel(field)}: choose a price from this studio's price list; the one linked is not in it.`, { field })
  }
}

export async function importPriceCsv(studioId: number, text: string) {
  const studio = await Studio.findByPk(studioId)
  const { prices, errors } = parsePriceCsv(text, { defaultCurrency: studio?.currency, fluid: studioFluidMeasure(studio ?? {}) })
  const sequelize = await useDb()
  const added = await sequelize.transaction(async () => {
    const rows = []
    for (const p of prices) {
      rows.push(priceView(await Price.create({
        studioId, item: p.item, packageSize: p.packageSize, packageUnit: p.packageUnit ?? 'each', priceMinor: p.priceMinor, currency: p.currency, shop: p.shop ?? null, boughtOn: p.date ?? null,
      })))
    }
    return rows
  })
  return { added, errors }
}

/**
 * The text of an upload: a multipart form's `field`, or the raw body (text/csv, JSON, HTML).
 * Refuses bodies over `maxBytes` with a 413 that says the limit.
 */
export async function readUploadText(event: H3Event, field: string, maxBytes: number): Promise<string> {
  const type = getRequestHeader(event, 'content-type') ?? ''
  const tooBig = () => new DomainError('too-large', `The upload is larger than ${Math.round(maxBytes / 1024)} KB; send a smaller file.`)
  // A multipart form carries its field names and boundaries beside the file: 16 KB allowed for them.
  await readBodyWithin(event, maxBytes + (type.startsWith('multipart/form-data') ? 16 * 1024 : 0), tooBig().message)
  if (type.startsWith('multipart/form-data')) {
    const parts = (await readMultipartFormData(event)) ?? []
    const part = parts.find((p) => p.name === field)
    if (!part) throw new DomainError('invalid', `Attach the file in a form field named "${field}", or send the text itself.`, { field: field })
    if (part.data.length > maxBytes) throw tooBig()
    return part.data.toString('utf8')
  }
  const raw = await readRawBody(event, 'utf8')
  if (!raw || !raw.trim()) throw new DomainError('invalid', 'The upload is empty; paste or attach the file.', { field: 'body' })
  if (Buffer.byteLength(raw) > maxBytes) throw tooBig()
  return raw
}
