import { adminRoutes } from './admin.routes.js'
import { auditRoutes } from './audit.routes.js'
import { authRoutes } from './auth.routes.js'
import { type RouteDef } from './define.js'
import { catalogueRoutes } from './catalogue.routes.js'
import { componentRoutes } from './components.routes.js'
import { dataSetRoutes } from './datasets.routes.js'
import { reportRoutes } from './reports.routes.js'
import { directDataRoutes } from './direct-data.routes.js'
import { jointFitRoutes } from './joint-fits.routes.js'
import { opsRoutes } from './ops.routes.js'
import { reviewRoutes } from './review.routes.js'
import { systemRoutes } from './systems.routes.js'

/** Every API route. A route is reachable only if it is listed here (deny by default). */
export const allRoutes: RouteDef[] = [
  ...authRoutes,
  ...adminRoutes,
  ...opsRoutes,
  ...componentRoutes,
  ...systemRoutes,
  ...dataSetRoutes,
  ...directDataRoutes,
  ...reviewRoutes,
  ...catalogueRoutes,
  ...auditRoutes,
  ...reportRoutes,
  ...jointFitRoutes,
]
