// Machine preparation shared by `npm start` and `npm test`: only Node's standard library here,
// because this runs before any dependency is installed.
import { execFileSync, spawnSync } from 'node:child_process'
import { existsSync } from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'

export const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..')

export function log(msg) {
  process.stdout.write(`\x1b[36m[ebullio]\x1b[0m ${msg}\n`)
}

export function has(cmd) {
  return spawnSync('sh', ['-c', `command -v ${cmd}`], { stdio: 'ignore' }).status === 0
}

export function run(cmd, args, opts = {}) {
  const r = spawnSync(cmd, args, { stdio: 'inherit', cwd: root, ...opts })
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')} failed with exit code ${r.status}`)
}

export const isRoot = typeof process.getuid === 'function' && process.getuid() === 0

/** Run a command as root: directly when we are root, through sudo otherwise. */
function asRoot(cmd, args) {
  if (isRoot) return run(cmd, args)
  if (!has('sudo')) throw new Error(`need root to run ${cmd} ${args.join(' ')} (no sudo found)`)
  return run('sudo', [cmd, ...args])
}

let aptUpdated = false
export function aptInstall(...pkgs) {
  log(`installing Debian packages: ${pkgs.join(' ')}`)
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' }
  if (!aptUpdated) {
    spawnSync(isRoot ? 'apt-get' : 'sudo', isRoot ? ['update', '-qq'] : ['apt-get', 'update', '-qq'], {
      stdio: 'inherit',
      env,
    })
    aptUpdated = true
  }
  asRoot('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...pkgs])
}

export function ensurePnpm() {
  if (has('pnpm')) return
  log('installing pnpm 10 (npm i -g pnpm@10)')
  run('npm', ['i', '-g', 'pnpm@10'])
}

export function ensureDependencies() {
  const stamp = path.join(root, 'node_modules', '.pnpm', 'lock.yaml')
  if (existsSync(stamp) && process.env.EBULLIO_SKIP_INSTALL === '1') return
  log('installing dependencies (pnpm install --frozen-lockfile)')
  run('pnpm', ['install', '--frozen-lockfile', '--prefer-offline', '--reporter=append-only'])
}

/** The directory holding initdb/pg_ctl, installing Debian's postgresql when missing. */
export function postgresBinDir() {
  const find = () => {
    try {
      const dir = execFileSync('pg_config', ['--bindir'], { encoding: 'utf8' }).trim()
      if (existsSync(path.join(dir, 'initdb'))) return dir
    } catch {
      // pg_config is not on PATH: look in Debian's versioned folders below
    }
    for (const v of ['17', '16', '15']) {
      const dir = `/usr/lib/postgresql/${v}/bin`
      if (existsSync(path.join(dir, 'initdb'))) return dir
    }
    return null
  }
  let dir = find()
  if (!dir) {
    aptInstall('postgresql')
    dir = find()
  }
  if (!dir) throw new Error('PostgreSQL server binaries not found after installing Debian package postgresql')
  return dir
}

/** Debian's chromium, installing it when missing. Returns the binary path. */
export function ensureChromium() {
  for (const c of [process.env.CHROMIUM_PATH, '/usr/bin/chromium', '/usr/bin/chromium-browser']) {
    if (c && existsSync(c)) return c
  }
  aptInstall('chromium')
  if (existsSync('/usr/bin/chromium')) return '/usr/bin/chromium'
  throw new Error('chromium not found after installing Debian package chromium')
}

/** Debian's haproxy (the reverse proxy of the replica test), installing it when missing. Returns the binary path. */
export function ensureHaproxy() {
  const find = () => ['/usr/sbin/haproxy', '/usr/bin/haproxy'].find((p) => existsSync(p)) ?? null
  let bin = find()
  if (!bin) {
    aptInstall('haproxy')
    bin = find()
  }
  if (!bin) throw new Error('haproxy not found after installing Debian package haproxy')
  return bin
}
