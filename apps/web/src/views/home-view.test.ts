/**
 * The overview page: each role sees a tile for every page its navigation offers, each with its line of explanation
 * (the lines live beside the routes, so a renamed page cannot lose its explanation as it once did).
 */
import type { Role } from '@ebullio/schemas'
import { mount, RouterLinkStub } from '@vue/test-utils'
import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it } from 'vitest'
import { appRoutes } from '../router/routes'
import { useSessionStore } from '../stores/session'
import HomeView from './HomeView.vue'

function homeFor(roles: Role[]) {
  const session = useSessionStore()
  session.user = { id: 'u1', email: 'u@lab.test', displayName: 'Ada Ng', roles, notifyMail: true }
  return mount(HomeView, { global: { stubs: { RouterLink: RouterLinkStub } } })
}

beforeEach(() => setActivePinia(createPinia()))

describe('overview page', () => {
  it('every navigation entry has its own non-empty explanation', () => {
    const navs = appRoutes.filter((r) => r.meta?.nav).map((r) => r.meta!.nav!)
    expect(navs.length).toBeGreaterThan(5)
    for (const n of navs) expect(n.hint.trim().length, n.label).toBeGreaterThan(20)
    expect(new Set(navs.map((n) => n.hint)).size).toBe(navs.length)
  })

  it.each([
    [['lead_chemist'] as Role[], ['Data sets', 'Components and systems', 'Instrument checks', 'Awaiting signature']],
    [['engineer'] as Role[], ['Approved systems']],
    [['admin'] as Role[], ['People and roles', 'GC methods', 'Undelivered mail']],
  ])('shows %j the tiles of their pages, each explained', (roles, labels) => {
    const w = homeFor(roles)
    const tiles = w.findAll('.tile')
    const shown = tiles.map((t) => t.find('strong').text())
    for (const l of labels) expect(shown).toContain(l)
    for (const t of tiles) expect(t.find('span').text().length).toBeGreaterThan(20)
    expect(shown).not.toContain('Your account')
  })
})
