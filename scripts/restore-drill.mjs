#!/usr/bin/env node
// Restore drill: restore a dump into a scratch database beside the live one, then recompute every stored signature
// digest with the app's own code (apps/api/src/ops/verify-signatures.ts). Exit 0 only when the restore worked and
// every signature matches its data.
//   node scripts/restore-drill.mjs [--url DATABASE_URL] [--dump FILE | --dir .data/backups] [--keep]
// --url names the server (and the database the dump came from); the scratch database is ebullio_drill_<time> on
// the same server and is dropped afterwards unless --keep.
import { spawnSync } from 'node:child_process'
import { readdirSync, statSync } from 'node:fs'
import path from 'node:path'
import { parseArgs } from 'node:util'
import pg from 'pg'
import { postgresBinDir, root } from './lib/system.mjs'

const { values: o } = parseArgs({
  options: {
    url: { type: 'string', default: process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54320/ebullio' },
    dump: { type: 'string' },
    dir: { type: 'string', default: process.env.BACKUP_DIR ?? path.join(root, '.data', 'backups') },
    keep: { type: 'boolean', default: false },
  },
})

function newestDump(dir) {
  const files = readdirSync(dir)
    .filter((f) => /^ebullio-.*\.dump$/.test(f))
    .map((f) => path.join(dir, f))
    .sort((a, b) => statSync(b).mtimeMs - statSync(a).mtimeMs)
  if (!files.length) throw new Error(`no ebullio-*.dump in ${dir}`)
  return files[0]
}

const dump = o.dump ?? newestDump(o.dir)
const scratchName = `ebullio_drill_${Date.now()}`
const admin = new URL(o.url)
admin.pathname = '/postgres'
const scratch = new URL(o.url)
scratch.pathname = `/${scratchName}`

const client = new pg.Client({ connectionString: admin.toString() })
await client.connect()
let code
try {
  await client.query(`create database "${scratchName}"`)
  console.log(`restoring ${path.basename(dump)} into ${scratchName}`)
  const r = spawnSync(
    path.join(postgresBinDir(), 'pg_restore'),
    ['--no-owner', '--exit-on-error', `--dbname=${scratch}`, dump],
    { encoding: 'utf8' },
  )
  if (r.status !== 0) throw new Error(`pg_restore failed: ${(r.stderr || '').trim()}`)
  const v = spawnSync(process.execPath, ['--import', 'tsx', 'apps/api/src/ops/verify-signatures-cli.ts'], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: scratch.toString() },
    encoding: 'utf8',
  })
  process.stdout.write(v.stdout)
  process.stderr.write(v.stderr)
  code = v.status ?? 2
  console.log(code === 0 ? 'restore drill passed' : 'restore drill FAILED')
} catch (e) {
  console.error(e instanceof Error ? e.message : e)
  code = 2
} finally {
  if (o.keep) console.log(`kept ${scratch}`)
  else await client.query(`drop database if exists "${scratchName}" with (force)`)
  await client.end()
}
process.exit(code)
