/**
 * The access rules on the app's real route table (components stubbed): signed out → sign-in with the way back,
 * wrong role → the 403 page, and a session that ends mid-use (401) → sign-in, back to the same page afterwards.
 */
import type { Role } from '@ebullio/schemas'
import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it, vi } from 'vitest'
import { createMemoryHistory, createRouter, type RouteRecordRaw } from 'vue-router'
import { api, ApiError } from '../api/client'
import { useSessionStore } from '../stores/session'
import { accessGuard, followSessionEnd } from './guards'
import { routes } from './routes'

vi.mock('../api/auth', () => ({ authApi: { me: vi.fn() } }))
import { authApi } from '../api/auth'

const Stub = { render: () => null }
const stubbed = (rs: RouteRecordRaw[]): RouteRecordRaw[] =>
  rs.map((r) => ({ ...r, component: Stub, children: r.children && stubbed(r.children) }) as RouteRecordRaw)

function app() {
  const router = createRouter({ history: createMemoryHistory(), routes: stubbed(routes) })
  router.beforeEach(accessGuard)
  return router
}
const me = (roles: Role[]) => ({
  user: { id: 'u1', email: 'u@lab.test', displayName: 'U', roles, notifyMail: true },
  devMode: false,
  labName: '',
})
const signedOut = () => vi.mocked(authApi.me).mockRejectedValue(new ApiError(401, 'unauthenticated', 'Sign in first.'))

beforeEach(() => {
  setActivePinia(createPinia())
  vi.clearAllMocks()
})

describe('route guards', () => {
  it('sends a signed-out person to sign-in with the page they asked for as the way back', async () => {
    signedOut()
    const router = app()
    await router.push('/datasets?state=draft')
    expect(router.currentRoute.value.name).toBe('sign-in')
    expect(router.currentRoute.value.query.next).toBe('/datasets?state=draft')
  })

  it('asks for no way back from the home page, and leaves public pages open', async () => {
    signedOut()
    const router = app()
    await router.push('/')
    expect(router.currentRoute.value.name).toBe('sign-in')
    expect(router.currentRoute.value.query).toEqual({})
    await router.push({ name: 'forgot' })
    expect(router.currentRoute.value.name).toBe('forgot')
  })

  it('shows the 403 page to a signed-in person without the role, naming the page refused', async () => {
    vi.mocked(authApi.me).mockResolvedValue(me(['engineer']))
    const router = app()
    await router.push('/approvals')
    expect(router.currentRoute.value.name).toBe('forbidden')
    expect(router.currentRoute.value.query.from).toBe('/approvals')
  })

  it('opens the page for a holder of one of its roles', async () => {
    vi.mocked(authApi.me).mockResolvedValue(me(['reviewer', 'lead_chemist']))
    const router = app()
    await router.push('/approvals')
    expect(router.currentRoute.value.name).toBe('approvals')
  })

  it('sends a signed-in person who opens the sign-in page where it would have returned them', async () => {
    vi.mocked(authApi.me).mockResolvedValue(me(['analyst']))
    const router = app()
    await router.push('/sign-in?next=/datasets')
    expect(router.currentRoute.value.fullPath).toBe('/datasets')
  })

  it('asks the server who is signed in once, not on every page', async () => {
    vi.mocked(authApi.me).mockResolvedValue(me(['analyst']))
    const router = app()
    await router.push('/datasets')
    await router.push('/threads')
    expect(authApi.me).toHaveBeenCalledTimes(1)
  })
})

describe('a session that ends while the app is open', () => {
  it('on a 401 answer forgets the user and goes to sign-in, with the current page as the way back', async () => {
    vi.mocked(authApi.me).mockResolvedValue(me(['analyst']))
    const router = app()
    const off = followSessionEnd(router)
    await router.push('/datasets?page=2')
    vi.stubGlobal(
      'fetch',
      vi.fn(async () =>
        Response.json({ error: { code: 'unauthenticated', message: 'Sign in again.' } }, { status: 401 }),
      ),
    )
    await expect(api.get('/api/datasets')).rejects.toMatchObject({ status: 401 })
    await vi.waitFor(() => expect(router.currentRoute.value.name).toBe('sign-in'))
    expect(router.currentRoute.value.query.next).toBe('/datasets?page=2')
    expect(useSessionStore().user).toBeNull()
    off()
    vi.unstubAllGlobals()
  })

  it('does not move a signed-out person whose sign-in attempt was refused', async () => {
    signedOut()
    const router = app()
    const off = followSessionEnd(router)
    await router.push('/sign-in')
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Response.json({ error: { code: 'invalid_credentials', message: 'No.' } }, { status: 401 })),
    )
    await expect(api.post('/api/auth/sign-in', {}, { quiet: true })).rejects.toThrow('No.')
    expect(router.currentRoute.value.fullPath).toBe('/sign-in')
    off()
    vi.unstubAllGlobals()
  })
})
