// Which pint a studio means. A bare "pint", "quart", "gallon" or "fl oz" is a US measure in a US
// kitchen and an imperial one in a British kitchen: the imperial pint is 568.26125 mL (Weights and
// Measures Act 1985, Schedule 1: gallon 4.54609 L, pint = gallon ÷ 8), the US pint 473.176 mL (NIST
// Handbook 44, Appendix C), 16.8 % less. The studio chooses; until it does, its locale decides
// (a studio in the United Kingdom, en-GB, means imperial; any other means US).
import { convertAmount, type UnitId } from './units'

export type FluidMeasure = 'us' | 'imperial'

/** The fluid measures a locale's kitchens use: imperial for the United Kingdom (region GB), US elsewhere. */
export function fluidMeasureForLocale(locale: string | null | undefined): FluidMeasure {
  const region = /^[a-z]{2,3}(?:[-_][A-Za-z]{4})?[-_]([A-Za-z]{2})\b/.exec(String(locale ?? ''))?.[1]?.toUpperCase()
  return region === 'GB' ? 'imperial' : 'us'
}

/** The studio's choice, or its locale's when it has not chosen. */
export function studioFluidMeasure(s: { fluidMeasure?: string | null; locale?: string | null }): FluidMeasure {
  return s.fluidMeasure === 'us' || s.fluidMeasure === 'imperial' ? s.fluidMeasure : fluidMeasureForLocale(s.locale)
}

const GENERIC: Partial<Record<UnitId, UnitId>> = { floz: 'imp-floz', pint: 'imp-pint', quart: 'imp-quart', gallon: 'imp-gallon' }

/** A bare fluid unit as the studio means it: "pint" is the imperial pint in an imperial studio. */
export function fluidUnit(unit: UnitId, fluid: FluidMeasure): UnitId {
  return fluid === 'imperial' ? (GENERIC[unit] ?? unit) : unit
}

/** What the screen says is in force: "Imperial fluid measures: 1 pint = 568 mL". */
export function fluidMeasureText(fluid: FluidMeasure): string {
  const pint = Math.round(convertAmount(1, fluid === 'imperial' ? 'imp-pint' : 'pint', 'ml'))
  return fluid === 'imperial'
    ? `Imperial fluid measures: 1 pint = ${pint} mL (UK, Weights and Measures Act 1985)`
    : `US fluid measures: 1 pint = ${pint} mL (US customary)`
}
