import { spawn, spawnSync, type ChildProcess } from 'node:child_process'
import { existsSync, readdirSync, readFileSync, rmSync } from 'node:fs'
import { connect } from 'node:net'
import path from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { dataDirFor } from '../../../scripts/lib/postgres.mjs'
import { isRoot, postgresBinDir } from '../../../scripts/lib/system.mjs'
import { freePort, repoRoot } from './processes.js'

/**
 * `npm start` (scripts/start.mjs) under the signals an operator sends: SIGINT to its whole process group (Ctrl-C in a
 * terminal) and SIGTERM to the script alone (`kill`, a service manager). Either way the app, its mail capture and its
 * PostgreSQL stop, and no process is left behind. A throw-away cluster on free ports, no demo data, no web build.
 */
let dir: string
let ports: { app: number; mail: number; pg: number }
let current: ChildProcess | null = null

beforeAll(async () => {
  ports = { app: await freePort(), mail: await freePort(), pg: await freePort() }
  dir = dataDirFor(repoRoot, `pg-start-${ports.pg}`)
})

afterAll(() => {
  if (current?.pid && current.exitCode === null) process.kill(-current.pid, 'SIGKILL')
  if (existsSync(path.join(dir, 'postmaster.pid'))) {
    const args = [path.join(postgresBinDir(), 'pg_ctl'), '-D', dir, 'stop', '-m', 'immediate', '-w']
    if (isRoot) spawnSync('runuser', ['-u', 'postgres', '--', ...args])
    else spawnSync(args[0], args.slice(1))
  }
  rmSync(dir, { recursive: true, force: true })
})

/** Whether something accepts TCP connections on this loopback port. */
function listening(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const s = connect({ host: '127.0.0.1', port })
    s.once('connect', () => {
      s.destroy()
      resolve(true)
    })
    s.once('error', () => resolve(false))
  })
}

/** Live processes (zombies excluded) with their parent and process group. */
function processes(): { pid: number; ppid: number; pgrp: number; cmd: string }[] {
  const out = []
  for (const name of readdirSync('/proc')) {
    if (!/^\d+$/.test(name)) continue
    try {
      const stat = readFileSync(`/proc/${name}/stat`, 'utf8')
      // pid (comm) state ppid pgrp …: comm may hold spaces and parentheses, so split after its last ')'
      const [state, ppid, pgrp] = stat.slice(stat.lastIndexOf(')') + 2).split(' ')
      if (state === 'Z') continue
      const cmd = readFileSync(`/proc/${name}/cmdline`, 'utf8').replace(/\0/g, ' ').trim()
      out.push({ pid: Number(name), ppid: Number(ppid), pgrp: Number(pgrp), cmd })
    } catch {
      /* ended meanwhile */
    }
  }
  return out
}

/** Start `node scripts/start.mjs` as its own process group and wait until it says it is ready. */
async function startIt(): Promise<{ proc: ChildProcess; exited: Promise<number | null>; output: () => string }> {
  const env: Record<string, string | undefined> = {
    ...process.env,
    DATABASE_URL: `postgres://postgres@127.0.0.1:${ports.pg}/ebullio_start_test`,
    EBULLIO_PG_DIR: dir,
    EBULLIO_SKIP_INSTALL: '1',
    EBULLIO_SKIP_WEB_BUILD: '1',
    DEMO_DATA: 'false',
    NODE_ENV: 'development',
    PORT: String(ports.app),
    FAKE_SMTP: 'true',
    FAKE_SMTP_PORT: String(ports.mail),
    LOG_LEVEL: 'warn',
    PUBLIC_URL: undefined,
    SMTP_URL: undefined,
  }
  const proc = spawn(process.execPath, ['scripts/start.mjs'], {
    cwd: repoRoot,
    env,
    detached: true, // its own process group, as a shell gives a foreground job
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  current = proc
  let out = ''
  proc.stdout!.on('data', (d) => (out += d))
  proc.stderr!.on('data', (d) => (out += d))
  const exited = new Promise<number | null>((resolve) => proc.on('exit', (code) => resolve(code)))
  const until = Date.now() + 150_000
  while (!out.includes('Ebullio is ready at')) {
    if (proc.exitCode !== null) throw new Error(`npm start ended (${proc.exitCode}) before it was ready:\n${out}`)
    if (Date.now() > until) throw new Error(`npm start was not ready within 150 s:\n${out}`)
    await new Promise((r) => setTimeout(r, 200))
  }
  return { proc, exited, output: () => out }
}

describe('signals sent to npm start', () => {
  for (const [signal, target] of [
    ['SIGINT', 'its process group (Ctrl-C)'],
    ['SIGTERM', 'the start script alone'],
  ] as const)
    it(`${signal} to ${target} stops the app, the mail capture and PostgreSQL, leaving no process`, async () => {
      const { proc, exited, output } = await startIt()
      const pid = proc.pid!
      // Everything is up: the app, the fake SMTP server and the cluster (whose server pid its pid file names).
      expect(await listening(ports.app)).toBe(true)
      expect(await listening(ports.mail)).toBe(true)
      expect(await listening(ports.pg)).toBe(true)
      const postmaster = Number(readFileSync(path.join(dir, 'postmaster.pid'), 'utf8').split('\n')[0])
      const group = processes().filter((p) => p.pgrp === pid)
      expect(group.length).toBeGreaterThanOrEqual(2) // the script and the app (node … server.ts)
      expect(group.some((p) => p.cmd.includes('server.ts'))).toBe(true)
      expect(processes().some((p) => p.ppid === postmaster)).toBe(true) // the cluster's own processes

      if (target.startsWith('its process group')) process.kill(-pid, signal)
      else process.kill(pid, signal)
      const code = await Promise.race([exited, new Promise<'late'>((r) => setTimeout(() => r('late'), 60_000))])
      expect(code, output()).toBe(0)

      expect(await listening(ports.app)).toBe(false)
      expect(await listening(ports.mail)).toBe(false)
      expect(await listening(ports.pg)).toBe(false)
      const left = processes().filter((p) => p.pgrp === pid || p.pid === postmaster || p.ppid === postmaster)
      expect(left, JSON.stringify(left)).toEqual([])
      expect(existsSync(path.join(dir, 'postmaster.pid'))).toBe(false)
      current = null
    }, 240_000)
})
