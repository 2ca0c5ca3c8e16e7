import { type Kysely, sql } from 'kysely'

/**
 * UNIQUAC becomes a fitted model of a data set (issue 13): fit.model may be 'uniquac' (its r and q come from the
 * components' properties and are stored in the fit's options). Frozen in time: never import app code here.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table fit drop constraint fit_model_check`.execute(db)
  await sql`alter table fit add constraint fit_model_check
    check (model in ('margules', 'van-laar', 'wilson', 'nrtl', 'uniquac'))`.execute(db)
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`delete from fit where model = 'uniquac'`.execute(db)
  await sql`alter table fit drop constraint fit_model_check`.execute(db)
  await sql`alter table fit add constraint fit_model_check
    check (model in ('margules', 'van-laar', 'wilson', 'nrtl'))`.execute(db)
}
