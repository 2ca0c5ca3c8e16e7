// Sizes of a built web app (default apps/web/dist): the largest chunks (raw, gzip) and what index.html loads up front — the sign-in page. Usage: node scripts/bundle-sizes.mjs [dist]
import { readFileSync, readdirSync } from 'node:fs'
import { gzipSync } from 'node:zlib'
import path from 'node:path'
const dist = process.argv[2] ?? 'apps/web/dist'
const assets = path.join(dist, 'assets')
const kb = (n) => (n / 1024).toFixed(1)
const rows = readdirSync(assets)
  .filter((f) => f.endsWith('.js') || f.endsWith('.css'))
  .map((f) => {
    const b = readFileSync(path.join(assets, f))
    return { f, raw: b.length, gz: gzipSync(b).length }
  })
  .sort((a, b) => b.raw - a.raw)
for (const r of rows.slice(0, 10)) console.log(`${kb(r.raw).padStart(8)} KB  ${kb(r.gz).padStart(7)} KB gz  ${r.f}`)
const html = readFileSync(path.join(dist, 'index.html'), 'utf8')
const up = [...html.matchAll(/(?:src|href)="\/assets\/([^"]+)"/g)].map((m) => m[1])
const first = rows.filter((r) => up.includes(r.f))
console.log('index.html loads:', up.join(' '))
console.log(
  `first load: ${kb(first.reduce((s, r) => s + r.raw, 0))} KB raw, ${kb(first.reduce((s, r) => s + r.gz, 0))} KB gzip`,
)
console.log(`all JS: ${kb(rows.filter((r) => r.f.endsWith('.js')).reduce((s, r) => s + r.raw, 0))} KB raw`)
