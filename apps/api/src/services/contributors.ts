/**
 * Who changed the content of a data set version, for the four-eyes rule and the approval record: its
 * creator, whoever uploaded a file behind its points (carried-over points of a revision count), excluded or
 * included a point, edited its metadata, or ran the fit that is recommended.
 */
import type { Db } from '../db/index.js'
import { actorsOf } from '../repositories/audit.repository.js'
import type { DataSetRecord } from '../repositories/datasets.repository.js'
import { findFit } from '../repositories/fits.repository.js'
import { uploadersOf } from '../repositories/uploads.repository.js'
import { displayNamesOf } from '../repositories/approvals.repository.js'

/** What a person did to the content, in words of the approval record. */
const ACTIONS: Record<string, string> = {
  'upload run file': 'uploaded points',
  'import point sheet': 'uploaded points',
  'enter points': 'entered points',
  'exclude point': 'excluded or included points',
  'include point': 'excluded or included points',
  'edit point': 'edited points',
  'update metadata': 'edited the metadata',
}

export interface Contributor {
  userId: string
  name: string
  changes: string[]
}

/** Everyone who changed the version's content, with what they did (sorted by name). */
export async function contributorsOf(db: Db, d: DataSetRecord): Promise<Contributor[]> {
  const did = new Map<string, Set<string>>()
  const add = (userId: string, what: string) => {
    if (!did.has(userId)) did.set(userId, new Set())
    did.get(userId)!.add(what)
  }
  add(d.createdBy, d.previousVersionId ? 'created this version' : 'created the data set')
  for (const u of await uploadersOf(db, d.id)) add(u, 'uploaded points')
  for (const a of await actorsOf(db, d.id, Object.keys(ACTIONS))) add(a.actorId, ACTIONS[a.action])
  if (d.recommendedFitId) {
    const fit = await findFit(db, d.recommendedFitId)
    if (fit) add(fit.runBy, 'ran the recommended fit')
  }
  const ids = [...did.keys()]
  const nameOf = await displayNamesOf(db, ids)
  return ids
    .map((userId) => ({ userId, name: nameOf.get(userId) ?? userId, changes: [...did.get(userId)!] }))
    .sort((a, b) => a.name.localeCompare(b.name))
}
