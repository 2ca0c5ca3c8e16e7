import type { Db } from '../db/index.js'
import { listApprovedSignatures } from '../repositories/approvals.repository.js'
import { contentDigest } from '../services/digest.js'

export interface SignatureCheck {
  checked: number
  mismatches: { approvalId: string; dataSetId: string; signedDigest: string; currentDigest: string | null }[]
}

/**
 * Recompute the digest of every approved data set with the app's own code and compare it with every approval
 * signature ("approved") stored for it. Used by the restore drill on a restored copy of the database.
 */
export async function verifyAllSignatures(db: Db): Promise<SignatureCheck> {
  const approvals = await listApprovedSignatures(db)
  const current = new Map<string, string | null>()
  const mismatches: SignatureCheck['mismatches'] = []
  for (const a of approvals) {
    if (!current.has(a.data_set_id))
      current.set(a.data_set_id, await contentDigest(db, a.data_set_id).catch(() => null))
    const now = current.get(a.data_set_id) ?? null
    if (now !== a.digest)
      mismatches.push({ approvalId: a.id, dataSetId: a.data_set_id, signedDigest: a.digest, currentDigest: now })
  }
  return { checked: approvals.length, mismatches }
}
