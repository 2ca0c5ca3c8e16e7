import type { RouteLocationNormalized, RouteLocationRaw, Router } from 'vue-router'
import { onUnauthorized } from '../api/client'
import { useSessionStore } from '../stores/session'

/** Where a signed-out person goes: the sign-in page, which returns them to `fullPath` afterwards. */
export const signInFor = (fullPath: string): RouteLocationRaw => ({
  name: 'sign-in',
  query: fullPath !== '/' ? { next: fullPath } : {},
})

/**
 * Before every page: public pages are open (a signed-in person asking for the sign-in page goes where it would
 * return them); other pages need a session, and pages with `meta.roles` one of those roles (else the 403 page).
 */
export async function accessGuard(to: RouteLocationNormalized): Promise<true | RouteLocationRaw> {
  const session = useSessionStore()
  if (!session.loaded) await session.load().catch(() => null)
  if (to.meta.public) {
    if (session.user && to.name === 'sign-in') return { path: (to.query.next as string) || '/' }
    return true
  }
  if (!session.user) return signInFor(to.fullPath)
  const roles = to.matched.flatMap((r) => r.meta.roles ?? [])
  if (roles.length && !session.can(...roles)) return { name: 'forbidden', query: { from: to.fullPath } }
  return true
}

/**
 * A 401 answer while the app believes someone is signed in means the session ended (expired, signed out
 * elsewhere, account deactivated): forget the user and go to the sign-in page, which brings them back here.
 */
export function followSessionEnd(router: Router): () => void {
  return onUnauthorized(() => {
    const session = useSessionStore()
    if (!session.user) return
    session.user = null
    const here = router.currentRoute.value
    if (!here.meta.public) void router.push(signInFor(here.fullPath))
  })
}
