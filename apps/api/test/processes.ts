// Real API processes for tests that need them (faults, shutdown, replicas): `tsx src/server.ts` as `npm start` runs it.
import { spawn, type ChildProcess } from 'node:child_process'
import { createServer } from 'node:net'
import path from 'node:path'
import { fileURLToPath, pathToFileURL } from 'node:url'
import { createRequire } from 'node:module'

export const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..')
const tsxCli = createRequire(import.meta.url).resolve('tsx/cli')
const tsxLoader = pathToFileURL(createRequire(import.meta.url).resolve('tsx/esm')).href

/** A TCP port nobody listens on right now (the OS picks it). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer()
    s.once('error', reject)
    s.listen(0, '127.0.0.1', () => {
      const a = s.address()
      const port = typeof a === 'object' && a ? a.port : 0
      s.close(() => resolve(port))
    })
  })
}

export interface ApiProcess {
  url: string
  port: number
  proc: ChildProcess
  /** Resolves with the exit code when the process ends. */
  exited: Promise<number | null>
  output: () => string
  stop: (signal?: NodeJS.Signals) => Promise<number | null>
}

export async function waitFor(url: string, ok: (status: number) => boolean, timeoutMs = 120_000): Promise<void> {
  const until = Date.now() + timeoutMs
  for (;;) {
    try {
      const r = await fetch(url)
      if (ok(r.status)) return
    } catch {
      /* not listening yet */
    }
    if (Date.now() > until) throw new Error(`${url} did not answer in ${timeoutMs} ms`)
    await new Promise((r) => setTimeout(r, 200))
  }
}

/** Start `apps/api/src/server.ts` with these settings and wait until /api/health answers. */
export async function startApi(env: Record<string, string>, o: { built?: boolean } = {}): Promise<ApiProcess> {
  const port = Number(env.PORT ?? (await freePort()))
  const url = `http://127.0.0.1:${port}`
  // node --import tsx/esm: one process (no tsx wrapper), so a signal reaches the app itself.
  // built: the production bundle (apps/api/dist/server.js) with plain node.
  const args = o.built
    ? [path.join(repoRoot, 'apps/api/dist/server.js')]
    : ['--import', tsxLoader, path.join(repoRoot, 'apps/api/src/server.ts')]
  const fullEnv: Record<string, string | undefined> = {
    ...process.env,
    NODE_ENV: 'test',
    LOG_LEVEL: 'warn',
    PUBLIC_URL: url,
    FAKE_SMTP: 'false',
    ...env,
    PORT: String(port),
  }
  for (const k of Object.keys(fullEnv)) if (fullEnv[k] === '') delete fullEnv[k] // '' = leave unset
  const proc = spawn(process.execPath, args, {
    cwd: repoRoot,
    env: fullEnv,
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  let out = ''
  proc.stdout!.on('data', (d) => (out += d))
  proc.stderr!.on('data', (d) => (out += d))
  const exited = new Promise<number | null>((resolve) => proc.on('exit', (code) => resolve(code)))
  const early = exited.then((code) => {
    throw new Error(`the API exited (${code}) before it answered:\n${out}`)
  })
  early.catch(() => {})
  try {
    await Promise.race([waitFor(`${url}/api/health`, (s) => s === 200), early])
  } catch (e) {
    proc.kill('SIGKILL') // never leave a half-started app behind
    throw e
  }
  return {
    url,
    port,
    proc,
    exited,
    output: () => out,
    stop: async (signal = 'SIGTERM') => {
      if (proc.exitCode === null && proc.signalCode === null) proc.kill(signal)
      return exited
    },
  }
}

/** Apply every migration to a database, in a child process as `pnpm migrate` does. */
export async function migrate(databaseUrl: string): Promise<void> {
  const { execFileSync } = await import('node:child_process')
  execFileSync(process.execPath, [tsxCli, path.join(repoRoot, 'db/migrate.ts')], {
    env: { ...process.env, DATABASE_URL: databaseUrl },
    stdio: 'pipe',
  })
}
