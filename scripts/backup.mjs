#!/usr/bin/env node
// Scheduled backup: pg_dump (custom format) into a folder, then retention.
//   node scripts/backup.mjs [--url DATABASE_URL] [--dir .data/backups] [--keep-days 14] [--min-keep 7]
// Files are named ebullio-<UTC time>.dump; a dump is written as .partial and renamed when complete, so a crash
// never leaves a file that looks whole. Dumps older than --keep-days are deleted, but the newest --min-keep always
// stay. Run it from cron or a systemd timer (docs/operations.md).
import { spawnSync } from 'node:child_process'
import { mkdirSync, readdirSync, renameSync, rmSync, statSync } from 'node:fs'
import path from 'node:path'
import { parseArgs } from 'node:util'
import { postgresBinDir, root } from './lib/system.mjs'

const { values: o } = parseArgs({
  options: {
    url: { type: 'string', default: process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54320/ebullio' },
    dir: { type: 'string', default: process.env.BACKUP_DIR ?? path.join(root, '.data', 'backups') },
    'keep-days': { type: 'string', default: '14' },
    'min-keep': { type: 'string', default: '7' },
  },
})

function dumpsIn(dir) {
  return readdirSync(dir)
    .filter((f) => /^ebullio-.*\.dump$/.test(f))
    .map((f) => ({ file: path.join(dir, f), mtime: statSync(path.join(dir, f)).mtimeMs }))
    .sort((a, b) => b.mtime - a.mtime)
}

mkdirSync(o.dir, { recursive: true })
const stamp = new Date()
  .toISOString()
  .replace(/[-:]/g, '')
  .replace(/\.\d+Z$/, 'Z')
const target = path.join(o.dir, `ebullio-${stamp}.dump`)
const partial = `${target}.partial`
const r = spawnSync(
  path.join(postgresBinDir(), 'pg_dump'),
  ['--format=custom', `--file=${partial}`, `--dbname=${o.url}`],
  {
    encoding: 'utf8',
  },
)
if (r.status !== 0) {
  rmSync(partial, { force: true })
  console.error(`pg_dump failed: ${(r.stderr || '').trim()}`)
  process.exit(1)
}
renameSync(partial, target)
console.log(`backup written: ${target} (${(statSync(target).size / 1024).toFixed(0)} KB)`)

const cutoff = Date.now() - Number(o['keep-days']) * 86_400_000
const all = dumpsIn(o.dir)
for (const [i, d] of all.entries()) {
  if (i < Number(o['min-keep'])) continue
  if (d.mtime < cutoff) {
    rmSync(d.file)
    console.log(`retention: deleted ${path.basename(d.file)}`)
  }
}
