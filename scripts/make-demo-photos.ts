// npx tsx scripts/make-demo-photos.ts — draws the demo studio's three photos, one for each demo
// recipe (server/db/demo-recipes.ts), as simple shapes in the Hobline palette only: the butter bean
// stew in its pot, the stack of pan flatbreads with the mint yoghurt, the roast squash on lentils with
// tahini. Renders them to 1200 × 800 JPEG with sharp and writes them with their thumbnails to
// server/db/demo-photos/. Run it again only to change the pictures; the files are committed, so the
// seeder never needs this script.
import { writeFileSync } from 'node:fs'
import sharp from 'sharp'
import { palette } from '../tailwind.config'
import { preparePhoto } from '../server/utils/photos'
import type { DemoPhotoName } from '../server/db/demo-photos'

const W = 1200
const H = 800
const { plan: p, set: s } = palette
const out = new URL('../server/db/demo-photos/', import.meta.url)

// The same scatter every run: a small linear congruential generator (Numerical Recipes' constants).
function scatter(seed: number) {
  let x = seed >>> 0
  return () => {
    x = (Math.imul(x, 1664525) + 1013904223) >>> 0
    return x / 2 ** 32
  }
}

/** `n` points inside an ellipse around (cx, cy), never two closer than `gap`. */
function pointsIn(seed: number, n: number, cx: number, cy: number, rx: number, ry: number, gap: number): [number, number][] {
  const rnd = scatter(seed)
  const points: [number, number][] = []
  for (let tries = 0; points.length < n && tries < n * 400; tries++) {
    const a = rnd() * Math.PI * 2
    const r = Math.sqrt(rnd())
    const pt: [number, number] = [cx + Math.cos(a) * r * rx, cy + Math.sin(a) * r * ry]
    if (points.every(([x, y]) => Math.hypot(x - pt[0], y - pt[1]) >= gap)) points.push(pt)
  }
  return points
}

const defs = `
  <filter id="shadow" x="-20%" y="-20%" width="140%" height="140%">
    <feGaussianBlur in="SourceAlpha" stdDeviation="14"/>
    <feOffset dx="10" dy="16" result="blur"/>
    <feComponentTransfer><feFuncA type="linear" slope="0.28"/></feComponentTransfer>
    <feMerge><feMergeNode/><feMergeNode in="SourceGraphic"/></feMerge>
  </filter>
  <filter id="soft"><feGaussianBlur stdDeviation="2.5"/></filter>`

const svg = (body: string, extraDefs = '') => `
<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}">
  <defs>${defs}${extraDefs}</defs>
  ${body}
</svg>`

// A herb leaf (parsley, mint): an ellipse with a midrib, turned about its own centre.
const leaf = (x: number, y: number, turn: number, size = 1, fill: string = p.basil) => `
  <g transform="translate(${x.toFixed(1)} ${y.toFixed(1)}) rotate(${turn.toFixed(0)}) scale(${size.toFixed(2)})">
    <ellipse rx="30" ry="14" fill="${fill}"/>
    <path d="M-26 0 Q0 -3 26 0" stroke="${s.mint}" stroke-opacity="0.55" stroke-width="2" fill="none"/>
  </g>`

// Chopped parsley: small ragged flecks in two greens.
const flecks = (seed: number, n: number, cx: number, cy: number, rx: number, ry: number) => {
  const rnd = scatter(seed + 7)
  return pointsIn(seed, n, cx, cy, rx, ry, 14).map(([x, y]) => {
    const r = 4 + rnd() * 5
    return `<path d="M${x - r} ${y} q${r * 0.6} ${-r} ${r} ${-r * 0.4} q${r * 0.9} ${-r * 0.3} ${r} ${r * 0.7} q${-r * 0.4} ${r} ${-r * 1.2} ${r * 0.6} z"
      fill="${rnd() < 0.7 ? p.basil : s.mint}" opacity="${(0.8 + rnd() * 0.2).toFixed(2)}"/>`
  }).join('')
}

// A butter bean from above: a broad kidney shape, creamy, with its faint seam.
const bean = (x: number, y: number, turn: number) => `
  <g transform="translate(${x.toFixed(1)} ${y.toFixed(1)}) rotate(${turn.toFixed(0)})">
    <path d="M-30 -4 C-30 -20 -8 -22 2 -17 C10 -13 14 -20 24 -18 C34 -15 34 10 18 17 C2 24 -30 18 -30 -4 Z" fill="${s.bone}" stroke="${p.line}" stroke-width="2"/>
    <path d="M-18 2 C-8 8 8 8 18 0" stroke="${p.line}" stroke-width="2.5" fill="none" stroke-linecap="round"/>
    <ellipse cx="-12" cy="-8" rx="9" ry="4" fill="${p.card}" opacity="0.7"/>
  </g>`

function stewPicture(): string {
  const rnd = scatter(11)
  const beans = pointsIn(3, 24, 560, 410, 215, 215, 52).map(([x, y]) => bean(x, y, rnd() * 360)).join('')
  // Tomato: soft chunks a shade darker than the sauce.
  const tomato = pointsIn(5, 16, 560, 410, 230, 230, 40).map(([x, y]) =>
    `<rect x="${(x - 13).toFixed(1)}" y="${(y - 11).toFixed(1)}" width="26" height="22" rx="8" fill="${p.paprika}" opacity="0.9" transform="rotate(${(rnd() * 90).toFixed(0)} ${x.toFixed(1)} ${y.toFixed(1)})"/>`).join('')
  // Smoked paprika: a dusting of small dark dots.
  const dust = pointsIn(9, 40, 560, 410, 250, 250, 18).map(([x, y]) => `<circle cx="${x.toFixed(1)}" cy="${y.toFixed(1)}" r="${(2 + rnd() * 2).toFixed(1)}" fill="${p.crust}" opacity="0.8"/>`).join('')
  return svg(`
  <rect width="${W}" height="${H}" fill="${s.panel}"/>
  ${Array.from({ length: 7 }, (_, i) => `<line x1="${i * 200}" y1="0" x2="${i * 200 - 300}" y2="${H}" stroke="${s.edge}" stroke-width="2" opacity="0.5"/>`).join('')}
  <g filter="url(#shadow)">
    <rect x="190" y="380" width="740" height="60" rx="28" fill="${s.night}"/>
    <circle cx="560" cy="410" r="330" fill="url(#pot)"/>
  </g>
  <circle cx="560" cy="410" r="300" fill="${s.night}"/>
  <circle cx="560" cy="410" r="286" fill="url(#stew)"/>
  ${tomato}${dust}${beans}
  ${flecks(21, 46, 560, 400, 240, 240)}
  ${leaf(470, 300, 25, 0.8)}${leaf(660, 520, -40, 0.75)}${leaf(640, 290, 70, 0.7)}
  <g transform="translate(1000 170)" filter="url(#shadow)">
    <circle r="105" fill="${p.card}"/>
    <circle r="82" fill="${p.paper}"/>
    ${flecks(31, 40, 0, 0, 70, 70)}
    ${leaf(-20, -15, 20, 0.8)}${leaf(25, 20, -50, 0.75)}
  </g>
  <g transform="translate(1010 560) rotate(-25)" filter="url(#shadow)">
    <circle r="62" fill="${p.paprika}"/>
    <circle r="52" fill="${s.ember}"/>
    ${[0, 72, 144, 216, 288].map((a) => `<ellipse rx="8" ry="18" fill="${p.paprika}" opacity="0.75" transform="rotate(${a}) translate(0 -26)"/>`).join('')}
    <circle r="9" fill="${s.bone}" opacity="0.8"/>
  </g>`, `
    <radialGradient id="pot" cx="45%" cy="40%" r="60%"><stop offset="0" stop-color="${s.edge}"/><stop offset="1" stop-color="${s.night}"/></radialGradient>
    <radialGradient id="stew" cx="45%" cy="40%" r="60%"><stop offset="0" stop-color="${s.ember}"/><stop offset="0.7" stop-color="${p.paprika}"/><stop offset="1" stop-color="${p.crust}"/></radialGradient>`)
}

// A flatbread from a little above: a flat, uneven round, golden, blistered with browned and charred spots.
function flatbread(seed: number, cx: number, cy: number, rx: number, ry: number): string {
  const rnd = scatter(seed)
  const edge = Array.from({ length: 14 }, (_, i) => {
    const a = (i / 14) * Math.PI * 2
    const k = 0.9 + rnd() * 0.16
    return [cx + Math.cos(a) * rx * k, cy + Math.sin(a) * ry * k]
  })
  const d = edge.map(([x, y], i) => {
    const [nx, ny] = edge[(i + 1) % edge.length]!
    return `${i === 0 ? `M${x!.toFixed(1)} ${y!.toFixed(1)} ` : ''}Q${x!.toFixed(1)} ${y!.toFixed(1)} ${((x! + nx!) / 2).toFixed(1)} ${((y! + ny!) / 2).toFixed(1)}`
  }).join(' ')
  const blisters = pointsIn(seed + 1, 34, cx, cy, rx * 0.84, ry * 0.8, 24).map(([x, y]) => {
    const r = 4 + rnd() * 14
    const charred = rnd() < 0.3
    return `<ellipse cx="${x.toFixed(1)}" cy="${y.toFixed(1)}" rx="${r.toFixed(1)}" ry="${(r * 0.7).toFixed(1)}" fill="${charred ? p.ink : p.crust}" opacity="${charred ? 0.55 : 0.6}" filter="url(#soft)"/>`
  }).join('')
  // Puffed bubbles: pale rings where the dough lifted.
  const bubbles = pointsIn(seed + 2, 6, cx, cy, rx * 0.7, ry * 0.65, 70).map(([x, y]) =>
    `<ellipse cx="${x.toFixed(1)}" cy="${y.toFixed(1)}" rx="26" ry="15" fill="none" stroke="${p.crust}" stroke-width="3" opacity="0.45"/>`).join('')
  return `
    <path d="${d} Z" transform="translate(0 7)" fill="${p.crust}"/>
    <path d="${d} Z" fill="url(#bread)"/>
    ${bubbles}${blisters}`
}

function flatbreadsPicture(): string {
  const grain = Array.from({ length: 10 }, (_, i) => `<path d="M140 ${180 + i * 52} q240 ${i % 2 ? 14 : -12} 470 0 t470 ${i % 3 ? 8 : -10}" stroke="${p.ink}" stroke-opacity="0.12" stroke-width="3" fill="none"/>`).join('')
  const yoghurtFlecks = flecks(41, 34, 0, 0, 95, 95)
  return svg(`
  <rect width="${W}" height="${H}" fill="url(#wall)"/>
  <rect y="90" width="${W}" height="710" fill="${p.ink}" opacity="0.08"/>
  <g filter="url(#shadow)">
    <rect x="110" y="130" width="1000" height="600" rx="34" fill="${p.crust}"/>
  </g>
  <rect x="110" y="130" width="1000" height="600" rx="34" fill="${p.paprika}" opacity="0.18"/>
  ${grain}
  <g filter="url(#shadow)">
    ${flatbread(101, 440, 520, 280, 165)}
  </g>
  ${[[102, 462, 504], [103, 432, 488], [104, 458, 472], [105, 438, 456], [106, 452, 440]].map(([seed, x, y]) => flatbread(seed!, x!, y!, 278, 163)).join('')}
  <g transform="translate(900 400)" filter="url(#shadow)">
    <ellipse rx="150" ry="130" fill="${p.card}"/>
    <ellipse rx="126" ry="108" fill="${p.line}"/>
    <ellipse rx="120" ry="102" cy="4" fill="${p.paper}"/>
    <path d="M-70 10 C-40 -40 40 -40 60 0 C40 30 -20 30 -10 0" stroke="${p.card}" stroke-width="10" fill="none" stroke-linecap="round" opacity="0.9"/>
    ${yoghurtFlecks}
    ${leaf(20, -40, 30, 0.9)}${leaf(-40, 30, -20, 0.85)}
  </g>
  ${leaf(1040, 640, 40, 1.1)}${leaf(1080, 600, -10, 1)}${leaf(1000, 680, 80, 0.9)}
  ${leaf(190, 190, -30, 0.9)}`, `
    <linearGradient id="wall" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="${p.paper}"/><stop offset="1" stop-color="${p.line}"/></linearGradient>
    <radialGradient id="bread" cx="45%" cy="40%" r="65%"><stop offset="0" stop-color="${s.bone}"/><stop offset="0.6" stop-color="${s.saffron}" stop-opacity="0.85"/><stop offset="1" stop-color="${p.crust}" stop-opacity="0.85"/></radialGradient>`)
}

function squashPicture(): string {
  const rnd = scatter(61)
  const lentils = pointsIn(63, 340, 680, 420, 200, 170, 11).map(([x, y]) => {
    const c = [p.crust, p.basil, p.muted, p.crust][Math.floor(rnd() * 4)]
    return `<ellipse cx="${x.toFixed(1)}" cy="${y.toFixed(1)}" rx="8" ry="5.5" fill="${c}" transform="rotate(${(rnd() * 180).toFixed(0)} ${x.toFixed(1)} ${y.toFixed(1)})"/>`
  }).join('')
  // Roast squash: chunky wedges, golden inside, browned at the edges.
  const chunks = [[600, 350, 20], [700, 330, -35], [790, 400, 60], [630, 450, -10], [740, 480, 35], [560, 420, 80], [690, 410, 5]].map(([x, y, t]) => `
    <g transform="translate(${x} ${y}) rotate(${t})">
      <path d="M-44 -26 L40 -32 Q52 -30 50 -18 L42 28 Q40 38 28 36 L-40 30 Q-52 28 -50 16 Z" fill="${p.crust}"/>
      <path d="M-38 -20 L36 -25 L34 24 L-36 22 Z" fill="url(#squash)"/>
      <path d="M-38 -20 L36 -25" stroke="${p.crust}" stroke-width="6" stroke-linecap="round" opacity="0.6"/>
    </g>`).join('')
  return svg(`
  <rect width="${W}" height="${H}" fill="${p.line}"/>
  ${Array.from({ length: 20 }, (_, i) => `<rect x="0" y="${i * 40}" width="${W}" height="18" fill="${p.paper}" opacity="0.35"/>`).join('')}
  <rect x="70" y="0" width="250" height="${H}" fill="${p.paprika}" opacity="0.9"/>
  <rect x="70" y="0" width="250" height="${H}" fill="none" stroke="${p.paper}" stroke-width="6" stroke-dasharray="2 14" opacity="0.6"/>
  <g filter="url(#shadow)">
    <circle cx="690" cy="400" r="310" fill="url(#china)"/>
  </g>
  <circle cx="690" cy="400" r="250" fill="none" stroke="${p.line}" stroke-width="4"/>
  <ellipse cx="680" cy="420" rx="215" ry="185" fill="${p.crust}" opacity="0.55"/>
  ${lentils}
  ${chunks}
  <path d="M520 330 C580 300 600 400 660 370 S760 300 800 360 S760 470 700 450 S590 500 560 470"
    stroke="${p.line}" stroke-width="17" fill="none" stroke-linecap="round"/>
  <path d="M520 330 C580 300 600 400 660 370 S760 300 800 360 S760 470 700 450 S590 500 560 470"
    stroke="${s.bone}" stroke-width="12" fill="none" stroke-linecap="round"/>
  <g transform="translate(820 560) rotate(-30)">
    <path d="M-60 0 A60 60 0 0 1 60 0 Z" fill="${s.saffron}"/>
    <path d="M-50 0 A50 50 0 0 1 50 0" stroke="${s.bone}" stroke-width="6" fill="none"/>
    <path d="M-64 0 A64 64 0 0 1 64 0" stroke="${p.crust}" stroke-width="3" fill="none" opacity="0.5"/>
  </g>
  <g filter="url(#shadow)" fill="${s.haze}">
    <rect x="1060" y="170" width="22" height="330" rx="10"/>
    <rect x="1046" y="500" width="50" height="12" rx="5"/>
    ${[0, 1, 2, 3].map((i) => `<rect x="${1048 + i * 13}" y="510" width="7" height="110" rx="3"/>`).join('')}
  </g>`, `
    <radialGradient id="china" cx="45%" cy="40%" r="65%"><stop offset="0" stop-color="${p.card}"/><stop offset="1" stop-color="${p.paper}"/></radialGradient>
    <radialGradient id="squash" cx="40%" cy="35%" r="75%"><stop offset="0" stop-color="${s.saffron}"/><stop offset="1" stop-color="${s.ember}"/></radialGradient>`)
}

const pictures: Record<DemoPhotoName, string> = { stew: stewPicture(), flatbreads: flatbreadsPicture(), squash: squashPicture() }

for (const [name, picture] of Object.entries(pictures)) {
  const jpeg = await sharp(Buffer.from(picture)).flatten({ background: p.paper }).jpeg({ quality: 82, mozjpeg: true }).toBuffer()
  // The same clean-up and thumbnail an upload gets.
  const { original, thumb } = await preparePhoto(jpeg)
  writeFileSync(new URL(`${name}.jpg`, out), original)
  writeFileSync(new URL(`${name}.thumb.webp`, out), thumb!)
  const meta = await sharp(original).metadata()
  console.log(`${name}.jpg ${meta.width}×${meta.height} ${(original.length / 1024).toFixed(0)} KB, thumbnail ${(thumb!.length / 1024).toFixed(0)} KB`)
}
