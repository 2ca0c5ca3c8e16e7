/** The audit log as the routes read it: a filtered page, answered by the repository as it is (no rule applies). */
export { listAudit } from '../repositories/audit.repository.js'
