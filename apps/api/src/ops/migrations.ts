import { existsSync, readdirSync } from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import type { Db } from '../db/index.js'
import { appliedMigrationNames } from '../repositories/migrations.repository.js'

/** The repository's db/migrations folder, found upwards from this file (works from src/ and from the built dist/). */
export function migrationsDir(start = path.dirname(fileURLToPath(import.meta.url))): string | null {
  for (let dir = start; ; dir = path.dirname(dir)) {
    const candidate = path.join(dir, 'db', 'migrations')
    if (existsSync(candidate)) return candidate
    if (path.dirname(dir) === dir) return null
  }
}

let expected: string[] | null = null
/** Migration names this build expects (file names without extension), read once. */
export function expectedMigrations(dir = migrationsDir()): string[] {
  if (expected) return expected
  if (!dir) return (expected = [])
  expected = readdirSync(dir)
    .filter((f) => /\.(ts|js|mjs)$/.test(f) && !f.endsWith('.d.ts'))
    .map((f) => f.replace(/\.(ts|js|mjs)$/, ''))
    .sort()
  return expected
}

/** Migrations this build knows that the database has not applied (throws when the database cannot be reached). */
export async function pendingMigrations(db: Db): Promise<string[]> {
  const applied = new Set(await appliedMigrationNames(db))
  return expectedMigrations().filter((m) => !applied.has(m))
}
