import { sql, type Kysely } from 'kysely'

/**
 * Joint fits (20261204_13j_joint_parameter_set.ts) over isothermal data sets and under a virial vapour, and their
 * return for rework.
 * - joint_fit.state gains 'returned': a lead chemist returned the submitted set for rework with a reason (a row in
 *   joint_fit_approval with meaning 'returned for rework'); it can be submitted again. Its result never changes
 *   (the guard of 13j still holds: only the state and submission columns move).
 * - joint_fit_approval.meaning gains 'returned for rework'.
 * - joint_fit_member.digest_format: how point_set_digest was computed. 'ebullio-point-set/1' (every member written
 *   before this migration): the digest of the points alone; 'ebullio-joint-member/2': the digest of the member's kind
 *   (isobaric or isothermal), its nominal temperature (isothermal), its vapour model and its points' digest, so a
 *   changed vapour model makes the joint fit stale. Adding the column rewrites no row (the members' guard stays).
 * Frozen in time: never import app code here.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table joint_fit drop constraint joint_fit_state_check`.execute(db)
  await sql`alter table joint_fit add constraint joint_fit_state_check
    check (state in ('draft', 'submitted', 'returned', 'approved', 'superseded'))`.execute(db)
  await sql`alter table joint_fit_approval drop constraint joint_fit_approval_meaning_check`.execute(db)
  await sql`alter table joint_fit_approval add constraint joint_fit_approval_meaning_check
    check (meaning in ('approved', 'returned for rework'))`.execute(db)
  await sql`alter table joint_fit_member add column digest_format text not null default 'ebullio-point-set/1'
    check (digest_format in ('ebullio-point-set/1', 'ebullio-joint-member/2'))`.execute(db)
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table joint_fit_member drop column digest_format`.execute(db)
  await sql`alter table joint_fit_approval drop constraint joint_fit_approval_meaning_check`.execute(db)
  await sql`alter table joint_fit_approval add constraint joint_fit_approval_meaning_check
    check (meaning in ('approved'))`.execute(db)
  await sql`alter table joint_fit drop constraint joint_fit_state_check`.execute(db)
  await sql`alter table joint_fit add constraint joint_fit_state_check
    check (state in ('draft', 'submitted', 'approved', 'superseded'))`.execute(db)
}
