/**
 * Property: whatever the order of uploads, exclusions, fits, recommendations, consistency runs, submits,
 * returns and approvals, a signed record only ever contains results computed on its signed point set, and
 * no step answers 500. Random action sequences (fast-check) on the documented example data (invented).
 */
import fc from 'fast-check'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { signedContentV2 } from '../src/services/digest.js'
import { createTestContext, PASSWORD, resetDatabase, type TestContext } from './helpers.js'
import { buildLab, csv, draftWithPoints, generatedRun, type Agent, type Lab } from './lab-fixture.js'

let t: TestContext
let lab: Lab
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
})
afterAll(() => t.close())

type Action =
  | { kind: 'upload'; seed: number }
  | { kind: 'exclude' | 'include'; index: number }
  | { kind: 'fit'; model: 'margules' | 'wilson'; lead: boolean }
  | { kind: 'recommend'; which: number }
  | { kind: 'consistency'; lead: boolean }
  | { kind: 'submit' | 'return' | 'approve' }

// Weighted towards the steps whose order matters (fit, recommend, change the points).
const action: fc.Arbitrary<Action> = fc.oneof(
  {
    weight: 1,
    arbitrary: fc.record({ kind: fc.constant('upload' as const), seed: fc.integer({ min: 1, max: 1_000_000 }) }),
  },
  {
    weight: 3,
    arbitrary: fc.record({ kind: fc.constantFrom('exclude' as const, 'include' as const), index: fc.nat(20) }),
  },
  {
    weight: 3,
    arbitrary: fc.record({
      kind: fc.constant('fit' as const),
      model: fc.constantFrom('margules' as const, 'wilson' as const),
      lead: fc.boolean(),
    }),
  },
  {
    weight: 3,
    arbitrary: fc.record({ kind: fc.constant('recommend' as const), which: fc.integer({ min: -1, max: 5 }) }),
  },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('consistency' as const), lead: fc.boolean() }) },
  {
    weight: 2,
    arbitrary: fc.record({ kind: fc.constantFrom('submit' as const, 'return' as const, 'approve' as const) }),
  },
)
/**
 * Tails that often reach a signature: 'fresh' fits, recommends the newest fit, tests, submits and approves;
 * 'as-is' recommends the oldest fit, then submits and approves whatever the random steps left (the case in
 * which a fit computed before the points changed would slip into a signature).
 */
const TAILS: Record<'none' | 'fresh' | 'as-is', Action[]> = {
  none: [],
  fresh: [
    { kind: 'fit', model: 'wilson', lead: false },
    { kind: 'recommend', which: -1 },
    { kind: 'consistency', lead: false },
    { kind: 'submit' },
    { kind: 'approve' },
  ],
  'as-is': [{ kind: 'recommend', which: 0 }, { kind: 'submit' }, { kind: 'approve' }],
}

interface Detail {
  state: string
  rowVersion: number
  recommendedFitId: string | null
  pointSetDigest: string
  points: { id: string; excluded: boolean }[]
  fits: { id: string; stale: boolean; pointSetDigest: string | null }[]
  consistency: { id: string; stale: boolean; pointSetDigest: string | null }[]
  approvals: {
    id: string
    meaning: string
    digest: string
    pointSetDigest: string | null
    outliers: { fitId: string } | null
  }[]
}

const read = async (id: string): Promise<Detail> => (await lab.reviewer.get(`/api/data-sets/${id}`).expect(200)).body

async function perform(id: string, a: Action): Promise<number> {
  const d = await read(id)
  const author: Agent = lab.analyst
  switch (a.kind) {
    case 'upload':
      return (
        await csv(author.post(`/api/data-sets/${id}/uploads`), generatedRun(3, a.seed), `run-${a.seed}.csv`)
          .field('rowVersion', String(d.rowVersion))
          .field('acceptWarnings', 'true')
      ).status
    case 'exclude':
    case 'include': {
      const p = d.points[a.index % d.points.length]
      return (
        await author.patch(`/api/data-sets/${id}/points/${p.id}`).send({
          rowVersion: d.rowVersion,
          excluded: a.kind === 'exclude',
          reason: a.kind === 'exclude' ? 'check' : null,
        })
      ).status
    }
    case 'fit':
      return (await (a.lead ? lab.lead : author).post(`/api/data-sets/${id}/fits`).send({ models: [a.model] })).status
    case 'recommend': {
      if (!d.fits.length) return 0
      const fit = a.which < 0 ? d.fits[d.fits.length - 1] : d.fits[a.which % d.fits.length]
      return (await lab.lead.post(`/api/data-sets/${id}/recommended-fit`).send({ fitId: fit.id })).status
    }
    case 'consistency':
      return (await (a.lead ? lab.lead : author).post(`/api/data-sets/${id}/consistency`).send({ model: 'wilson' }))
        .status
    case 'submit':
      return (await author.post(`/api/data-sets/${id}/submit`).send({ rowVersion: d.rowVersion })).status
    case 'return':
    case 'approve':
      return (
        await lab.lead2
          .post(`/api/data-sets/${id}/${a.kind}`)
          .send({ password: PASSWORD, reason: 'Property check.', rowVersion: d.rowVersion })
      ).status
  }
}

/** The invariant, checked after every step. */
async function checkInvariant(id: string) {
  const d = await read(id)
  for (const sig of d.approvals) expect(sig.pointSetDigest).not.toBeNull()
  const approved = d.approvals.filter((s) => s.meaning === 'approved')
  if (approved.length) {
    expect(d.state).toBe('approved')
    const sig = approved.at(-1)!
    // the signed point set is the data set's point set, and the recommended fit was computed on it
    expect(sig.pointSetDigest).toBe(d.pointSetDigest)
    const rec = d.fits.find((f) => f.id === d.recommendedFitId)!
    expect(rec.stale).toBe(false)
    expect(rec.pointSetDigest).toBe(sig.pointSetDigest)
    if (sig.outliers) expect(sig.outliers.fitId).toBe(rec.id)
    const verify = await lab.reviewer.get(`/api/data-sets/${id}/signatures/verify`).expect(200)
    expect(verify.body.signatures.find((s: { id: string }) => s.id === sig.id).matches).toBe(true)
  }
  // whatever is signed now would hold only results computed on the current point set
  const content = (await signedContentV2(t.db, id))!
  if (content.recommendedFit) expect(content.recommendedFit.pointSetDigest).toBe(content.pointSet.digest)
  for (const c of content.consistency) expect(c.pointSetDigest).toBe(content.pointSet.digest)
}

describe('a signed record only contains results computed on its signed point set', () => {
  it('holds over random sequences of lab actions', async () => {
    let run = 0
    await fc.assert(
      fc.asyncProperty(
        fc.array(action, { minLength: 2, maxLength: 7 }),
        fc.constantFrom<keyof typeof TAILS>('as-is', 'fresh', 'as-is', 'none'),
        async (actions, tail) => {
          const d = await draftWithPoints(t, lab, `Property run ${++run}`)
          for (const a of [...actions, ...TAILS[tail]]) {
            const status = await perform(d.id, a)
            expect(status, `${a.kind} answered ${status}`).toBeLessThan(500)
            await checkInvariant(d.id)
            if ((await read(d.id)).state === 'approved') break
          }
        },
      ),
      { numRuns: 14, endOnFailure: true },
    )
  }, 300_000)
})
