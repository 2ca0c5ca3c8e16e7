import { createRouter, createWebHistory } from 'vue-router'
import { useSessionStore } from '../stores/session'
import './meta'
import { routes } from './routes'

export const router = createRouter({ history: createWebHistory(), routes })

router.beforeEach(async (to) => {
  const session = useSessionStore()
  if (!session.loaded) await session.load().catch(() => null)
  if (to.meta.public) {
    if (session.user && to.name === 'sign-in') return { path: (to.query.next as string) || '/' }
    return true
  }
  if (!session.user) return { name: 'sign-in', query: to.fullPath !== '/' ? { next: to.fullPath } : {} }
  const roles = to.matched.flatMap((r) => r.meta.roles ?? [])
  if (roles.length && !session.can(...roles)) return { name: 'forbidden', query: { from: to.fullPath } }
  return true
})

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Ebullio` : 'Ebullio'
})
