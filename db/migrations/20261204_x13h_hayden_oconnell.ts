import { type Kysely, sql } from 'kysely'

/**
 * The virial vapour of a data set may use the Hayden–O'Connell correlation (issue 13).
 * - data_set.vapor_model: a virial choice names its correlation, 'tsonopoulos' or 'hayden-oconnell'; under
 *   Hayden–O'Connell it may carry eta12 (the unlike pair's solvation parameter, a number from 0 to 10) and
 *   eta12Source (text). Rows made before this migration all say 'tsonopoulos' (the API's default).
 * - component.properties (jsonb, checked by the API) gains radiusOfGyration (Å), associationEta and
 *   associationSource; no change to the column.
 * Frozen in time: never import app code here.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table data_set add constraint data_set_vapor_correlation check (
    vapor_model->>'kind' <> 'virial'
    or (coalesce(vapor_model->>'correlation', 'tsonopoulos') in ('tsonopoulos', 'hayden-oconnell')
      and (not vapor_model ? 'eta12' or case when jsonb_typeof(vapor_model->'eta12') = 'number'
        then (vapor_model->>'eta12')::double precision between 0 and 10 else false end)))`.execute(db)
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table data_set drop constraint data_set_vapor_correlation`.execute(db)
}
