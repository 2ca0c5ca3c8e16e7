import { existsSync, readFileSync } from 'node:fs'
import path from 'node:path'

/** Values from .env (if any) under the ones already in the environment. */
export function loadDotEnv(root) {
  const file = path.join(root, '.env')
  if (!existsSync(file)) return {}
  const out = {}
  for (const line of readFileSync(file, 'utf8').split(/\r?\n/)) {
    const m = line.match(/^\s*([A-Z0-9_]+)\s*=\s*(.*)\s*$/)
    if (m && !line.trimStart().startsWith('#')) out[m[1]] = m[2].replace(/^(['"])(.*)\1$/, '$2')
  }
  return out
}

/** The port of a postgres:// URL, or a default. */
export function portOf(url, fallback) {
  try {
    return Number(new URL(url).port) || fallback
  } catch {
    return fallback
  }
}
