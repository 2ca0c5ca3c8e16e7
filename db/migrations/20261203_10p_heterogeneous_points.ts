import { sql, type Kysely } from 'kysely'

/**
 * Points whose liquid split into two layers in the still (heterogeneous points): a flag, and the x1 of both
 * layers when they were analysed (I the poorer in component 1, so x1_phase_i ≤ x1_phase_ii), with standard
 * uncertainties. Their GC injections are stored with phase `upper` or `lower`. Frozen in time: never import
 * app code here.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('point')
    .addColumn('heterogeneous', 'boolean', (c) => c.notNull().defaultTo(false))
    .addColumn('x1_phase_i', 'double precision')
    .addColumn('x1_phase_i_uncertainty', 'double precision')
    .addColumn('x1_phase_ii', 'double precision')
    .addColumn('x1_phase_ii_uncertainty', 'double precision')
    .execute()
  await sql`alter table point add constraint point_liquid_phases check (
    (x1_phase_i is null and x1_phase_ii is null and x1_phase_i_uncertainty is null and x1_phase_ii_uncertainty is null)
    or (heterogeneous and x1_phase_i is not null and x1_phase_ii is not null
        and x1_phase_i_uncertainty is not null and x1_phase_ii_uncertainty is not null
        and x1_phase_i >= 0 and x1_phase_ii <= 1 and x1_phase_i <= x1_phase_ii))`.execute(db)
  await sql`alter table point_injection drop constraint point_injection_phase_check`.execute(db)
  await sql`alter table point_injection add constraint point_injection_phase_check
    check (phase in ('liquid', 'vapour', 'upper', 'lower'))`.execute(db)
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table point_injection drop constraint point_injection_phase_check`.execute(db)
  await sql`alter table point_injection add constraint point_injection_phase_check
    check (phase in ('liquid', 'vapour'))`.execute(db)
  await sql`alter table point drop constraint point_liquid_phases`.execute(db)
  await db.schema
    .alterTable('point')
    .dropColumn('heterogeneous')
    .dropColumn('x1_phase_i')
    .dropColumn('x1_phase_i_uncertainty')
    .dropColumn('x1_phase_ii')
    .dropColumn('x1_phase_ii_uncertainty')
    .execute()
}
