import { hash, verify } from '@node-rs/argon2'

// argon2id with the OWASP-recommended minimum (19 MiB, 2 passes, 1 lane); argon2id is the library's default algorithm.
const OPTIONS = { memoryCost: 19456, timeCost: 2, parallelism: 1, outputLen: 32 }

export function hashPassword(password: string): Promise<string> {
  return hash(password, OPTIONS)
}

export async function verifyPassword(passwordHash: string | null, password: string): Promise<boolean> {
  if (!passwordHash) return false
  try {
    return await verify(passwordHash, password)
  } catch {
    return false
  }
}

/** A hash of nothing, verified against when the e-mail is unknown so both paths take the same time. */
let dummy: Promise<string> | null = null
export function dummyHash(): Promise<string> {
  dummy ??= hashPassword('not-a-real-password-for-timing')
  return dummy
}
