import { createRouter, createWebHistory } from 'vue-router'
import { accessGuard, followSessionEnd } from './guards'
import './meta'
import { routes } from './routes'

export const router = createRouter({ history: createWebHistory(), routes })

router.beforeEach(accessGuard)
followSessionEnd(router)

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Ebullio` : 'Ebullio'
})
