// `DATABASE_URL=… node --import tsx apps/api/src/ops/verify-signatures-cli.ts`: recompute every signed digest.
// Exit 0 when all match, 1 when one does not (each named), 2 when the check itself failed.
import { createDb } from '../db/index.js'
import { verifyAllSignatures } from './verify-signatures.js'

const url = process.env.DATABASE_URL
if (!url) {
  console.error('DATABASE_URL is not set')
  process.exit(2)
}
const db = createDb(url)
try {
  const r = await verifyAllSignatures(db)
  for (const m of r.mismatches)
    console.log(
      `MISMATCH approval ${m.approvalId} of data set ${m.dataSetId}: signed ${m.signedDigest}, now ${m.currentDigest ?? 'missing'}`,
    )
  console.log(`${r.checked - r.mismatches.length} of ${r.checked} signatures match their data`)
  process.exitCode = r.mismatches.length ? 1 : 0
} catch (e) {
  console.error('signature check failed:', e instanceof Error ? e.message : e)
  process.exitCode = 2
} finally {
  await db.destroy()
}
