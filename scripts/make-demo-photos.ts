// npx tsx scripts/make-demo-photos.ts — draws the demo studio's three photos (a plate, a pan, a loaf)
// as simple shapes in the Hobline palette, renders them to 1200 × 800 JPEG with sharp and writes
// them with their thumbnails to server/db/demo-photos/. Run it again only to change the pictures;
// the files are committed, so the seeder never needs this script.
import { writeFileSync } from 'node:fs'
import sharp from 'sharp'
import { palette } from '../tailwind.config'
import { preparePhoto } from '../server/utils/photos'
import type { DemoPhotoName } from '../server/db/demo-photos'

const W = 1200
const H = 800
const { plan: p, set: s } = palette
const out = new URL('../server/db/demo-photos/', import.meta.url)

const defs = `
  <filter id="shadow" x="-20%" y="-20%" width="140%" height="140%">
    <feGaussianBlur in="SourceAlpha" stdDeviation="14"/>
    <feOffset dx="10" dy="16" result="blur"/>
    <feComponentTransfer><feFuncA type="linear" slope="0.28"/></feComponentTransfer>
    <feMerge><feMergeNode/><feMergeNode in="SourceGraphic"/></feMerge>
  </filter>
  <filter id="soft"><feGaussianBlur stdDeviation="3"/></filter>`

// A few basil leaves: an ellipse with a midrib, turned about its own centre.
const leaf = (x: number, y: number, turn: number, size = 1) => `
  <g transform="translate(${x} ${y}) rotate(${turn}) scale(${size})">
    <ellipse rx="34" ry="15" fill="${p.basil}"/>
    <path d="M-30 0 Q0 -3 30 0" stroke="${s.mint}" stroke-opacity="0.55" stroke-width="2" fill="none"/>
  </g>`

const plate = `
<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}">
  <defs>${defs}
    <radialGradient id="china" cx="45%" cy="40%" r="65%"><stop offset="0" stop-color="#ffffff"/><stop offset="1" stop-color="${p.paper}"/></radialGradient>
    <radialGradient id="mound" cx="40%" cy="35%" r="70%"><stop offset="0" stop-color="${s.saffron}"/><stop offset="1" stop-color="${p.crust}"/></radialGradient>
  </defs>
  <rect width="${W}" height="${H}" fill="${p.line}"/>
  ${Array.from({ length: 20 }, (_, i) => `<rect x="0" y="${i * 40}" width="${W}" height="18" fill="${p.paper}" opacity="0.35"/>`).join('')}
  <rect x="70" y="0" width="250" height="${H}" fill="${p.paprika}" opacity="0.9"/>
  <rect x="70" y="0" width="250" height="${H}" fill="none" stroke="${p.paper}" stroke-width="6" stroke-dasharray="2 14" opacity="0.6"/>
  <g filter="url(#shadow)">
    <circle cx="690" cy="400" r="310" fill="url(#china)"/>
  </g>
  <circle cx="690" cy="400" r="230" fill="none" stroke="${p.line}" stroke-width="4"/>
  <ellipse cx="670" cy="410" rx="150" ry="120" fill="url(#mound)"/>
  ${[[600, 360], [650, 440], [720, 380], [700, 470], [760, 430], [620, 470], [730, 330]].map(([x, y]) => `<circle cx="${x}" cy="${y}" r="7" fill="${p.paper}" opacity="0.55"/>`).join('')}
  ${[[805, 300], [840, 380], [795, 520], [560, 290]].map(([x, y]) => `
    <circle cx="${x}" cy="${y}" r="34" fill="${p.paprika}"/><circle cx="${x! - 6}" cy="${y! - 6}" r="20" fill="${s.ember}"/>
    <circle cx="${x! - 6}" cy="${y! - 6}" r="6" fill="${s.saffron}" opacity="0.8"/>`).join('')}
  ${leaf(610, 540, 20)}${leaf(560, 500, -35, 0.8)}${leaf(770, 250, 60, 0.9)}${leaf(850, 470, -70, 0.7)}
  <g filter="url(#shadow)" fill="${s.haze}">
    <rect x="1060" y="170" width="22" height="330" rx="10"/>
    <rect x="1046" y="500" width="50" height="12" rx="5"/>
    ${[0, 1, 2, 3].map((i) => `<rect x="${1048 + i * 13}" y="510" width="7" height="110" rx="3"/>`).join('')}
  </g>
</svg>`

const pan = `
<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}">
  <defs>${defs}
    <radialGradient id="iron" cx="45%" cy="40%" r="60%"><stop offset="0" stop-color="${s.edge}"/><stop offset="1" stop-color="${s.night}"/></radialGradient>
    <radialGradient id="sauce" cx="45%" cy="40%" r="60%"><stop offset="0" stop-color="${s.ember}"/><stop offset="1" stop-color="${p.paprika}"/></radialGradient>
    <radialGradient id="glow" cx="50%" cy="50%" r="50%"><stop offset="0.7" stop-color="${s.ember}" stop-opacity="0.5"/><stop offset="1" stop-color="${s.ember}" stop-opacity="0"/></radialGradient>
  </defs>
  <rect width="${W}" height="${H}" fill="${s.panel}"/>
  ${Array.from({ length: 7 }, (_, i) => `<line x1="${i * 200}" y1="0" x2="${i * 200 - 300}" y2="${H}" stroke="${s.edge}" stroke-width="2" opacity="0.5"/>`).join('')}
  <circle cx="520" cy="420" r="370" fill="url(#glow)"/>
  <g filter="url(#shadow)">
    <rect x="820" y="380" width="360" height="70" rx="30" fill="${s.night}"/>
    <circle cx="520" cy="415" r="320" fill="url(#iron)"/>
  </g>
  <circle cx="1130" cy="415" r="14" fill="${s.panel}"/>
  <circle cx="520" cy="415" r="282" fill="url(#sauce)"/>
  ${[[430, 320], [620, 330], [400, 500], [600, 520], [515, 420]].map(([x, y], i) => `
    <g transform="rotate(${i * 37} ${x} ${y})">
      <ellipse cx="${x}" cy="${y}" rx="70" ry="58" fill="${s.bone}"/>
      <circle cx="${x! + 6}" cy="${y! - 4}" r="27" fill="${s.saffron}"/>
      <circle cx="${x! - 2}" cy="${y! - 12}" r="8" fill="#ffffff" opacity="0.6"/>
    </g>`).join('')}
  ${leaf(700, 430, 30, 0.6)}${leaf(350, 400, -20, 0.55)}${leaf(520, 620, 75, 0.6)}${leaf(480, 230, 10, 0.5)}
  ${[[330, 300], [690, 260], [720, 560], [300, 560], [560, 300], [450, 600]].map(([x, y]) => `<circle cx="${x}" cy="${y}" r="5" fill="${p.crust}"/>`).join('')}
</svg>`

const loaf = `
<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}">
  <defs>${defs}
    <linearGradient id="wall" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="${p.paper}"/><stop offset="1" stop-color="${p.line}"/></linearGradient>
    <linearGradient id="board" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#b8793a"/><stop offset="1" stop-color="${p.crust}"/></linearGradient>
    <radialGradient id="crust" cx="40%" cy="25%" r="80%"><stop offset="0" stop-color="${s.saffron}"/><stop offset="0.55" stop-color="#c7782a"/><stop offset="1" stop-color="${p.crust}"/></radialGradient>
    <radialGradient id="crumb" cx="50%" cy="40%" r="60%"><stop offset="0" stop-color="${s.bone}"/><stop offset="1" stop-color="#ead9b8"/></radialGradient>
  </defs>
  <rect width="${W}" height="${H}" fill="url(#wall)"/>
  <rect y="560" width="${W}" height="240" fill="${p.ink}" opacity="0.12"/>
  <g filter="url(#shadow)">
    <rect x="150" y="540" width="960" height="70" rx="26" fill="url(#board)"/>
    <path d="M180 545 C190 320 360 250 540 250 C720 250 860 320 870 545 Z" fill="url(#crust)"/>
  </g>
  ${[300, 420, 540, 660].map((x) => `<path d="M${x - 40} ${360 + Math.abs(x - 540) / 4} Q${x} ${300 + Math.abs(x - 540) / 4} ${x + 50} ${335 + Math.abs(x - 540) / 4}" stroke="${s.bone}" stroke-width="14" stroke-linecap="round" fill="none" opacity="0.75"/>`).join('')}
  <g filter="url(#shadow)">
    <g transform="rotate(10 960 540)">
      <rect x="890" y="365" width="92" height="178" rx="30" fill="${p.crust}"/>
      <rect x="901" y="377" width="70" height="158" rx="24" fill="url(#crumb)"/>
    </g>
    <g transform="rotate(3 1020 540)">
      <rect x="975" y="362" width="92" height="180" rx="30" fill="${p.crust}"/>
      <rect x="986" y="374" width="70" height="160" rx="24" fill="url(#crumb)"/>
    </g>
  </g>
  ${[[880, 560], [905, 572], [1050, 566], [860, 575], [1075, 558]].map(([x, y]) => `<circle cx="${x}" cy="${y}" r="5" fill="#ead9b8"/>`).join('')}
  <rect x="150" y="600" width="960" height="6" fill="${p.ink}" opacity="0.15" filter="url(#soft)"/>
  <g transform="translate(30 480)" filter="url(#shadow)">
    <rect x="0" y="0" width="76" height="104" rx="16" fill="${p.basil}"/>
    <rect x="10" y="-14" width="56" height="20" rx="8" fill="${p.muted}"/>
    <rect x="12" y="30" width="52" height="40" rx="6" fill="${p.paper}" opacity="0.85"/>
  </g>
</svg>`

const pictures: Record<DemoPhotoName, string> = { plate, pan, loaf }

for (const [name, svg] of Object.entries(pictures)) {
  const jpeg = await sharp(Buffer.from(svg)).flatten({ background: p.paper }).jpeg({ quality: 82, mozjpeg: true }).toBuffer()
  // The same clean-up and thumbnail an upload gets.
  const { original, thumb } = await preparePhoto(jpeg)
  writeFileSync(new URL(`${name}.jpg`, out), original)
  writeFileSync(new URL(`${name}.thumb.webp`, out), thumb!)
  const meta = await sharp(original).metadata()
  console.log(`${name}.jpg ${meta.width}×${meta.height} ${(original.length / 1024).toFixed(0)} KB, thumbnail ${(thumb!.length / 1024).toFixed(0)} KB`)
}
