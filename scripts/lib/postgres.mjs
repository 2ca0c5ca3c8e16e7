// A private PostgreSQL cluster on loopback, owned by the `postgres` user when we run as root
// (PostgreSQL refuses to run as root).
import { spawnSync, execFileSync } from 'node:child_process'
import { existsSync, mkdirSync, writeFileSync, chmodSync, rmSync } from 'node:fs'
import path from 'node:path'
import { isRoot, log, postgresBinDir } from './system.mjs'

function asOwner(bin, args, opts = {}) {
  const full = [bin, ...args]
  const r = isRoot
    ? spawnSync('runuser', ['-u', 'postgres', '--', ...full], { encoding: 'utf8', ...opts })
    : spawnSync(full[0], full.slice(1), { encoding: 'utf8', ...opts })
  return r
}

function must(r, what) {
  if (r.status !== 0) throw new Error(`${what} failed: ${(r.stderr || r.stdout || '').trim()}`)
  return r
}

/**
 * @param {{ dataDir: string, port: number, database: string, fresh?: boolean }} o
 * @returns {{ url: string, stop: () => void }}
 */
export function startCluster({ dataDir, port, database, fresh = false }) {
  const bin = postgresBinDir()
  const pgCtl = path.join(bin, 'pg_ctl')
  if (fresh && existsSync(dataDir)) {
    asOwner(pgCtl, ['-D', dataDir, 'stop', '-m', 'immediate'])
    rmSync(dataDir, { recursive: true, force: true })
  }
  if (!existsSync(path.join(dataDir, 'PG_VERSION'))) {
    log(`initialising PostgreSQL cluster in ${dataDir}`)
    mkdirSync(dataDir, { recursive: true })
    if (isRoot) execFileSync('chown', ['-R', 'postgres:postgres', dataDir])
    chmodSync(dataDir, 0o700)
    must(
      asOwner(path.join(bin, 'initdb'), [
        '-D',
        dataDir,
        '-U',
        'postgres',
        '-A',
        'trust',
        '-E',
        'UTF8',
        '--locale=C.UTF-8',
      ]),
      'initdb',
    )
    const conf = [
      "listen_addresses = '127.0.0.1'",
      `port = ${port}`,
      `unix_socket_directories = '${dataDir}'`,
      'fsync = on',
      'log_min_messages = warning',
    ]
    writeFileSync(path.join(dataDir, 'ebullio.conf'), conf.join('\n') + '\n')
    must(asOwner('sh', ['-c', `echo "include 'ebullio.conf'" >> ${dataDir}/postgresql.conf`]), 'configure')
    if (isRoot) execFileSync('chown', ['postgres:postgres', path.join(dataDir, 'ebullio.conf')])
  }
  const start = () => {
    const status = asOwner(pgCtl, ['-D', dataDir, 'status'])
    if (status.status === 0) return
    log(`starting PostgreSQL on 127.0.0.1:${port}`)
    must(
      asOwner(pgCtl, [
        '-D',
        dataDir,
        '-l',
        path.join(dataDir, 'server.log'),
        '-w',
        '-t',
        '60',
        '-o',
        `-p ${port} -k ${dataDir}`,
        'start',
      ]),
      'pg_ctl start',
    )
  }
  start()
  const psql = path.join(bin, 'psql')
  const exists = asOwner(psql, [
    '-h',
    '127.0.0.1',
    '-p',
    String(port),
    '-U',
    'postgres',
    '-tAc',
    `SELECT 1 FROM pg_database WHERE datname='${database}'`,
  ])
  if (!exists.stdout.includes('1')) {
    must(
      asOwner(path.join(bin, 'createdb'), ['-h', '127.0.0.1', '-p', String(port), '-U', 'postgres', database]),
      'createdb',
    )
  }
  return {
    url: `postgres://postgres@127.0.0.1:${port}/${database}`,
    stop: () => {
      asOwner(pgCtl, ['-D', dataDir, 'stop', '-m', 'fast', '-w'])
    },
    /** Start it again after stop() (for fault tests). */
    start,
    /** Stop and delete the cluster's folder (throw-away clusters only). */
    destroy: () => {
      asOwner(pgCtl, ['-D', dataDir, 'stop', '-m', 'immediate', '-w'])
      rmSync(dataDir, { recursive: true, force: true })
    },
  }
}

/** The directory for cluster data: inside the project, unless the postgres user cannot reach it. */
export function dataDirFor(root, name) {
  const inside = path.join(root, '.data', name)
  if (!isRoot) return inside
  mkdirSync(path.join(root, '.data'), { recursive: true })
  const probe = spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-x', path.join(root, '.data')])
  if (probe.status === 0) return inside
  // A checkout under a home directory with mode 700: fall back to a folder postgres can reach.
  const alt = path.join('/var/tmp', `ebullio-${Buffer.from(root).toString('hex').slice(-16)}`, name)
  log(`postgres cannot reach ${inside}; using ${alt}`)
  return alt
}
