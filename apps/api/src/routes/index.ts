import { adminRoutes } from './admin.routes.js'
import { authRoutes } from './auth.routes.js'
import { defineRoutes, type RouteDef } from './define.js'

const healthRoutes = defineRoutes([
  { method: 'get', path: '/api/health', access: 'public', handler: (_req, res) => void res.json({ ok: true }) },
])

/** Every API route. A route is reachable only if it is listed here (deny by default). */
export const allRoutes: RouteDef[] = [
  ...authRoutes,
  ...adminRoutes,
  ...healthRoutes,
]
