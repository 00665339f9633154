// WCAG 2.2 colour contrast: "relative luminance" and "contrast ratio" as WCAG defines them
// (Understanding SC 1.4.3), with the sRGB linearisation of IEC 61966-2-1 (threshold 0.04045).

export function relativeLuminance(hex: string): number {
  const m = /^#?([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex)
  if (!m) throw new Error(`"${hex}" is not a colour in #rrggbb form`)
  const [r, g, b] = m.slice(1).map((h) => parseInt(h, 16) / 255).map((c) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4))
  return 0.2126 * r! + 0.7152 * g! + 0.0722 * b!
}

export function contrastRatio(a: string, b: string): number {
  const [hi, lo] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x)
  return (hi! + 0.05) / (lo! + 0.05)
}

/** The WCAG level a pair of text colours reaches for normal-size text: AAA (7:1), AA (4.5:1) or none. */
export function contrastLevel(ratio: number): 'AAA' | 'AA' | 'fail' {
  if (ratio >= 7) return 'AAA'
  if (ratio >= 4.5) return 'AA'
  return 'fail'
}
