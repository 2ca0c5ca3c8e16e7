import { type Kysely, sql } from 'kysely'

/**
 * UNIQUAC becomes a model of joint fits too: joint_fit.model may be 'uniquac' (temperature-dependent a12, a21; r and q
 * of the components stored in the joint fit's options and activity). Frozen in time: never import app code here.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table joint_fit drop constraint joint_fit_model_check`.execute(db)
  await sql`alter table joint_fit add constraint joint_fit_model_check
    check (model in ('nrtl', 'wilson', 'uniquac'))`.execute(db)
}

/** Undo: draft UNIQUAC joint fits go (their members with them); a submitted or signed one stops the undo. */
export async function down(db: Kysely<any>): Promise<void> {
  await sql`delete from joint_fit where model = 'uniquac' and state = 'draft'`.execute(db)
  const left = await sql<{ n: number }>`select count(*)::int as n from joint_fit where model = 'uniquac'`.execute(db)
  if (left.rows[0].n > 0)
    throw new Error(
      `${left.rows[0].n} UNIQUAC joint fit(s) are submitted or signed and stay in the record; this migration cannot be undone.`,
    )
  await sql`alter table joint_fit drop constraint joint_fit_model_check`.execute(db)
  await sql`alter table joint_fit add constraint joint_fit_model_check
    check (model in ('nrtl', 'wilson'))`.execute(db)
}
