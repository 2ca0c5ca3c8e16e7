/**
 * The Pinia stores against a mocked API: what each keeps, caches, clears and reports when the server answers or
 * refuses. The API modules are replaced wholesale, so a store that called the network directly would fail here.
 */
import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it, vi } from 'vitest'
import { ApiError } from '../api/client'

vi.mock('../api/auth', () => ({ authApi: { me: vi.fn(), signIn: vi.fn(), signOut: vi.fn() } }))
vi.mock('../api/datasets', () => ({
  datasetsApi: { list: vi.fn(), create: vi.fn(), get: vi.fn(), submit: vi.fn(), recommend: vi.fn() },
}))
vi.mock('../api/systems-lab', () => ({ systemsLabApi: { component: vi.fn() } }))
vi.mock('../api/comments', () => ({ commentsApi: { mine: vi.fn(), create: vi.fn() } }))
vi.mock('../api/catalogue', () => ({ catalogueApi: { list: vi.fn(), parameters: vi.fn(), measured: vi.fn() } }))
vi.mock('../api/admin', () => ({ adminApi: { users: vi.fn(), activate: vi.fn(), deactivate: vi.fn() } }))
vi.mock('../api/gc', () => ({
  gcApi: { methods: vi.fn(), calibrations: vi.fn(), systems: vi.fn(), retire: vi.fn(), retireMethod: vi.fn() },
}))
vi.mock('../api/components', () => ({
  componentsApi: { list: vi.fn(), get: vi.fn(), remove: vi.fn(), update: vi.fn() },
}))
vi.mock('../api/reports', () => ({ reportsApi: { verify: vi.fn() } }))

import { adminApi } from '../api/admin'
import { authApi } from '../api/auth'
import { catalogueApi } from '../api/catalogue'
import { commentsApi } from '../api/comments'
import { componentsApi } from '../api/components'
import { datasetsApi } from '../api/datasets'
import { gcApi } from '../api/gc'
import { reportsApi } from '../api/reports'
import { systemsLabApi } from '../api/systems-lab'
import { useCatalogueStore } from './catalogue'
import { useComponentsStore } from './components'
import { useDatasetsStore } from './datasets'
import { useGcStore } from './gc'
import { useReportsStore } from './reports'
import { useSessionStore } from './session'
import { useThreadsStore } from './threads'
import { useUsersStore } from './users'
import { useWorkspaceStore } from './workspace'

/** The mocked function behind an API method. */
const mocked = <F>(f: F) => f as unknown as ReturnType<typeof vi.fn>
/** A promise the test settles by hand, to interleave two requests. */
function deferred<T>() {
  let resolve!: (v: T) => void
  const promise = new Promise<T>((r) => (resolve = r))
  return { promise, resolve }
}

beforeEach(() => {
  setActivePinia(createPinia())
  vi.clearAllMocks()
})

describe('session store', () => {
  const me = { id: 'u1', email: 'a@lab.test', displayName: 'A', roles: ['analyst'], notifyMail: true }

  it('keeps the signed-in user, the lab name and the roles it answers can()', async () => {
    mocked(authApi.me).mockResolvedValue({ user: me, devMode: false, labName: 'North lab' })
    const s = useSessionStore()
    expect(await s.load()).toEqual(me)
    expect([s.loaded, s.labName]).toEqual([true, 'North lab'])
    expect(s.can('analyst')).toBe(true)
    expect(s.can('lead_chemist', 'admin')).toBe(false)
    expect(s.can('admin', 'analyst')).toBe(true)
  })

  it('treats 401 as signed out, but lets any other failure through (and is loaded either way)', async () => {
    const s = useSessionStore()
    mocked(authApi.me).mockRejectedValueOnce(new ApiError(401, 'unauthenticated', 'Sign in.'))
    expect(await s.load()).toBeNull()
    expect(s.loaded).toBe(true)
    mocked(authApi.me).mockRejectedValueOnce(new ApiError(500, 'internal', 'Broken.'))
    await expect(s.load()).rejects.toThrow('Broken.')
  })

  it('forgets the user on sign-out even when the server call fails', async () => {
    mocked(authApi.me).mockResolvedValue({ user: me, devMode: false, labName: '' })
    const s = useSessionStore()
    await s.load()
    mocked(authApi.signOut).mockRejectedValue(new ApiError(0, 'network', 'Offline.'))
    await expect(s.signOut()).rejects.toThrow('Offline.')
    expect(s.user).toBeNull()
    expect(s.can('analyst')).toBe(false)
  })
})

describe('workspace store', () => {
  const detail = (state: string, id = 'd1') => ({
    dataSet: { id, state, rowVersion: 4 },
    system: { id: 's1', component1: { id: 'c1' }, component2: { id: 'c2' } },
    comments: [],
  })
  const component = (A: number) => ({
    vaporPressureSets: [
      { preferred: false, parameters: { A: A + 1 } },
      { preferred: true, parameters: { A } },
    ],
  })

  it('loads a data set with the preferred vapour-pressure sets, asking for them once per system', async () => {
    mocked(datasetsApi.get).mockImplementation(async () => detail('draft'))
    mocked(systemsLabApi.component).mockImplementation(async (id: string) => component(id === 'c1' ? 10 : 20))
    const w = useWorkspaceStore()
    await w.load('d1')
    expect(w.detail?.vaporPressure).toEqual([{ A: 10 }, { A: 20 }])
    await w.reload()
    expect(datasetsApi.get).toHaveBeenCalledTimes(2)
    expect(systemsLabApi.component).toHaveBeenCalledTimes(2) // not 4: the second load used the cache
    expect(w.loading).toBe(false)
  })

  it('keeps the status and message of a refused load and shows no data set', async () => {
    mocked(datasetsApi.get).mockRejectedValue(new ApiError(404, 'not_found', 'No such data set.'))
    const w = useWorkspaceStore()
    await w.load('gone')
    expect([w.status, w.error, w.detail, w.loading]).toEqual([404, 'No such data set.', null, false])
  })

  it('is editable only as a draft or when returned', async () => {
    mocked(systemsLabApi.component).mockResolvedValue(component(1))
    const w = useWorkspaceStore()
    const editable: Record<string, boolean> = {}
    for (const state of ['draft', 'returned', 'submitted', 'approved', 'superseded']) {
      mocked(datasetsApi.get).mockResolvedValueOnce(detail(state))
      await w.load('d1')
      editable[state] = w.editable
    }
    expect(editable).toEqual({ draft: true, returned: true, submitted: false, approved: false, superseded: false })
  })

  it('submits with the version it saw and answers how many lead chemists were told', async () => {
    mocked(systemsLabApi.component).mockResolvedValue(component(1))
    mocked(datasetsApi.get).mockResolvedValue(detail('draft'))
    const w = useWorkspaceStore()
    await w.load('d1')
    mocked(datasetsApi.submit).mockResolvedValueOnce({ notifiedLeadChemists: 0 })
    expect(await w.submit()).toBe(0)
    expect(datasetsApi.submit).toHaveBeenCalledWith('d1', 4)
    mocked(datasetsApi.submit).mockResolvedValueOnce({})
    expect(await w.submit()).toBeNull()
    expect(datasetsApi.get).toHaveBeenCalledTimes(3) // reloaded after each submit
  })
})

describe('catalogue store', () => {
  it('loads the catalogue only when the system asked for is not in it, and caches parameters', async () => {
    mocked(catalogueApi.list).mockResolvedValue({ items: [{ system: { id: 's1' } }], total: 1 })
    const c = useCatalogueStore()
    expect(await c.entry('s1')).toEqual({ system: { id: 's1' } })
    expect(await c.entry('s1')).toEqual({ system: { id: 's1' } })
    expect(catalogueApi.list).toHaveBeenCalledTimes(1)
    expect(await c.entry('s2')).toBeNull()
    expect(catalogueApi.list).toHaveBeenCalledTimes(2)
    mocked(catalogueApi.parameters).mockResolvedValue({ recommendedFitId: 'f1' })
    await c.parametersOf('d1')
    expect(await c.parametersOf('d1')).toEqual({ recommendedFitId: 'f1' })
    expect(catalogueApi.parameters).toHaveBeenCalledTimes(1)
  })

  it('keeps only id, points and residuals of the measured fits, and the vapour-correction check', async () => {
    const vc = { exceeds: true, kind: 'isobaric', maxAbsDy: 0.008, maxAbsDT: 0.26, maxAbsDP: null }
    mocked(catalogueApi.measured).mockResolvedValue({
      points: [{ id: 'p1' }],
      fits: [{ id: 'f1', pointIds: ['p1'], residuals: [0.1], parameters: { a: 1 } }],
      vapourCorrection: vc,
    } as never)
    const c = useCatalogueStore()
    expect(await c.measuredOf('d1')).toEqual({
      points: [{ id: 'p1' }],
      fits: [{ id: 'f1', pointIds: ['p1'], residuals: [0.1] }],
      vapourCorrection: vc,
    })
  })
})

describe('list stores', () => {
  it('data sets: a refused page empties the list and keeps the message', async () => {
    const d = useDatasetsStore()
    mocked(datasetsApi.list).mockResolvedValueOnce({ items: [{ id: 'a' }], total: 7 })
    await d.load({} as never)
    expect([d.items.length, d.total]).toEqual([1, 7])
    mocked(datasetsApi.list).mockRejectedValueOnce(new ApiError(500, 'x', 'Server trouble.'))
    await d.load({} as never)
    expect([d.items, d.total, d.error, d.loading]).toEqual([[], 0, 'Server trouble.', false])
  })

  it('users: the answer to the latest search wins, whatever order the answers come in', async () => {
    const u = useUsersStore()
    const first = deferred<{ items: { id: string }[]; total: number }>()
    const second = deferred<{ items: { id: string }[]; total: number }>()
    mocked(adminApi.users).mockReturnValueOnce(first.promise).mockReturnValueOnce(second.promise)
    u.filter.q = '  ann  '
    const a = u.load()
    u.filter.q = 'anna'
    const b = u.load()
    second.resolve({ items: [{ id: 'anna' }], total: 1 })
    await b
    expect(u.loading).toBe(false)
    first.resolve({ items: [{ id: 'ann' }, { id: 'anna' }], total: 2 })
    await a
    expect(u.items).toEqual([{ id: 'anna' }])
    expect(mocked(adminApi.users).mock.calls[0][0].q).toBe('ann') // trimmed
  })

  it('gc: names systems by id, and retiring a calibration reads only the calibrations again', async () => {
    mocked(gcApi.methods).mockResolvedValue({ items: [{ id: 'm1' }] })
    mocked(gcApi.calibrations).mockResolvedValue({ items: [{ id: 'k1' }] })
    mocked(gcApi.systems).mockResolvedValue({ items: [{ id: 's1', name: 'water / ethanol' }] })
    const g = useGcStore()
    await g.load()
    expect(g.systemNames).toEqual({ s1: 'water / ethanol' })
    mocked(gcApi.calibrations).mockResolvedValue({ items: [] })
    await g.retire('k1')
    expect(g.calibrations).toEqual([])
    expect(gcApi.methods).toHaveBeenCalledTimes(1)
  })

  it('components: removing the open component closes it', async () => {
    mocked(componentsApi.get).mockResolvedValue({ id: 'c1' })
    mocked(componentsApi.list).mockResolvedValue({ items: [], total: 0 })
    const c = useComponentsStore()
    await c.open('c1')
    await c.remove('c2')
    expect(c.current).toEqual({ id: 'c1' })
    await c.remove('c1')
    expect(c.current).toBeNull()
  })

  it('threads and reports: a refusal is kept as the message and the flags reset', async () => {
    mocked(commentsApi.mine).mockRejectedValue(new Error('No threads today.'))
    const t = useThreadsStore()
    await t.load()
    expect([t.error, t.loading]).toEqual(['No threads today.', false])
    const r = useReportsStore()
    mocked(reportsApi.verify).mockResolvedValueOnce({ matches: true })
    await r.verify('r1')
    expect(r.verification).toEqual({ matches: true })
    mocked(reportsApi.verify).mockRejectedValueOnce(new Error('Unknown report.'))
    await r.verify('r2')
    expect([r.verification, r.error, r.loading]).toEqual([null, 'Unknown report.', false])
  })
})
