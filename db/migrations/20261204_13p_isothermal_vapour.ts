import { type Kysely, sql } from 'kysely'

/**
 * Isobaric or isothermal data sets, the vapour model chosen per data set, σP per point, and two more derived
 * results.
 * - data_set.layout gains 'px' (isothermal P–x, no vapour analysed). 'txy' and 'tx' are isobaric (a nominal
 *   pressure), 'pxy' and 'px' isothermal (a nominal temperature, nominal_temperature_k; the nominal pressure may be
 *   null). Isothermal sets made before this migration have no nominal temperature (the constraint is NOT VALID
 *   for them; the API uses the mean of their points' temperatures).
 * - data_set.vapor_model: { kind: 'ideal' } or { kind: 'virial', correlation: 'tsonopoulos', poynting: boolean }.
 *   The critical data come from the components' properties when a computation runs and are kept with its result.
 * - point.pressure_uncertainty_pa: σP of a measured pressure (Pa, standard uncertainty), null = the engine's default.
 * - consistency_result.test gains 'redlich-kister-area' (the area test of isothermal data) and 'quality-score'.
 * Frozen in time: never import app code here.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table data_set drop constraint data_set_layout_check`.execute(db)
  await sql`alter table data_set
    add constraint data_set_layout_check check (layout in ('txy', 'tx', 'pxy', 'px')),
    add column nominal_temperature_k double precision check (nominal_temperature_k > 0),
    alter column nominal_pressure_pa drop not null,
    add constraint data_set_isobaric_pressure check (layout in ('pxy', 'px') or nominal_pressure_pa is not null),
    add column vapor_model jsonb not null default '{"kind": "ideal"}'::jsonb,
    add constraint data_set_vapor_model check (
      jsonb_typeof(vapor_model) = 'object' and vapor_model->>'kind' in ('ideal', 'virial'))`.execute(db)
  await sql`alter table data_set add constraint data_set_isothermal_temperature
    check (layout not in ('pxy', 'px') or nominal_temperature_k is not null) not valid`.execute(db)
  await sql`alter table point add column pressure_uncertainty_pa double precision
    check (pressure_uncertainty_pa is null or pressure_uncertainty_pa > 0)`.execute(db)
  await sql`alter table consistency_result drop constraint consistency_result_test_check`.execute(db)
  await sql`alter table consistency_result add constraint consistency_result_test_check
    check (test in ('herington-area', 'redlich-kister-area', 'point', 'quality-score'))`.execute(db)
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table consistency_result drop constraint consistency_result_test_check`.execute(db)
  await sql`alter table consistency_result add constraint consistency_result_test_check
    check (test in ('herington-area', 'point'))`.execute(db)
  await sql`alter table point drop column pressure_uncertainty_pa`.execute(db)
  await sql`alter table data_set drop constraint data_set_isothermal_temperature,
    drop constraint data_set_vapor_model, drop column vapor_model,
    drop constraint data_set_isobaric_pressure, drop column nominal_temperature_k,
    drop constraint data_set_layout_check`.execute(db)
  await sql`alter table data_set add constraint data_set_layout_check check (layout in ('txy', 'tx', 'pxy'))`.execute(
    db,
  )
}
