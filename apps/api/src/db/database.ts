import type { AuthTables } from './auth-tables.js'
import type { JointFitTables } from './joint-fit-tables.js'
import type { LabTables } from './lab-tables.js'
import type { ReportTables } from './report-tables.js'

/** Every table Ebullio reads or writes, typed for Kysely. */
export interface Database extends AuthTables, LabTables, ReportTables, JointFitTables {}
