import { AppError } from '../errors/index.js'
import { isDatabaseUnavailable, databaseUnavailable } from '../errors/unavailable.js'
import { pendingMigrations } from '../ops/migrations.js'
import { defineRoutes } from './define.js'

/**
 * Liveness (`/api/health`: the process answers; never touches the database) and readiness (`/api/ready`: the
 * database answers and has every migration this build expects), for a reverse proxy or an orchestrator.
 */
export const opsRoutes = defineRoutes([
  { method: 'get', path: '/api/health', access: 'public', handler: (_req, res) => void res.json({ ok: true }) },
  {
    method: 'get',
    path: '/api/ready',
    access: 'public',
    handler: async (req, res) => {
      let pending: string[]
      try {
        pending = await pendingMigrations(req.ctx.db)
      } catch (err) {
        if (isDatabaseUnavailable(err)) throw databaseUnavailable()
        throw err
      }
      if (pending.length)
        throw new AppError(503, 'migrations_pending', 'The database lacks migrations this version needs.', {
          pending,
        })
      res.set('Cache-Control', 'no-store').json({ ok: true, database: 'up', migrations: 'current' })
    },
  },
])
