import { sql, type Kysely } from 'kysely'

/**
 * Critical constants and structure parameters of a component, with their source, for a non-ideal vapour
 * (second virial coefficients) and UNIQUAC: one JSON document per component, checked by the API
 * (packages/schemas componentPropertiesSchema). Null until someone enters them.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('component').addColumn('properties', 'jsonb').execute()
  await sql`ALTER TABLE component ADD CONSTRAINT component_properties_object
    CHECK (properties IS NULL OR jsonb_typeof(properties) = 'object')`.execute(db)
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('component').dropColumn('properties').execute()
}
