import { type Kysely, sql } from 'kysely'

/**
 * The lab data model: components, systems, GC methods and calibrations, data sets with their
 * points, fits, consistency results, comments, signatures and the audit trail.
 * Frozen in time: never import app code here. Rules that must hold whatever the app does
 * (approved data immutable, audit log and signatures append-only) are triggers below.
 * Quantities are stored in SI (K, Pa, mole fractions); raw values stay in the uploaded files.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await createFunctions(db)
  await createCatalogueTables(db)
  await createCalibrationTables(db)
  await createDataSetTables(db)
  await createReviewTables(db)
  await createTriggers(db)
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const t of [
    'audit_log',
    'approval',
    'comment',
    'consistency_result',
    'point_injection',
    'point',
    'fit',
    'data_set',
    'upload',
    'calibration_injection',
    'calibration_standard',
    'calibration',
    'gc_method',
    'binary_system',
    'pure_measurement',
    'vapor_pressure_set',
    'component',
  ]) {
    await sql`drop table if exists ${sql.table(t)} cascade`.execute(db)
  }
  for (const f of ['lab_cas_valid(text)', 'lab_reject_change()', 'lab_data_set_guard()', 'lab_child_guard()']) {
    await sql.raw(`drop function if exists ${f} cascade`).execute(db)
  }
}

async function createFunctions(db: Kysely<any>): Promise<void> {
  // CAS check digit: sum of the other digits weighted 1, 2, 3… from the right, modulo 10.
  await sql`
    create function lab_cas_valid(cas text) returns boolean language plpgsql immutable as $$
    declare digits text; total int := 0; i int; n int;
    begin
      if cas !~ '^[0-9]{2,7}-[0-9]{2}-[0-9]$' then return false; end if;
      digits := replace(cas, '-', '');
      n := length(digits);
      for i in 1..(n - 1) loop
        total := total + (n - i) * substr(digits, i, 1)::int;
      end loop;
      return total % 10 = substr(digits, n, 1)::int;
    end $$`.execute(db)
}

async function createCatalogueTables(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('component')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('name', 'text', (c) => c.notNull().unique())
    .addColumn('cas_number', 'text', (c) => c.unique().check(sql`lab_cas_valid(cas_number)`))
    .addColumn('formula', 'text')
    .addColumn('molar_mass', 'double precision', (c) => c.notNull().check(sql`molar_mass > 0`))
    .addColumn('liquid_molar_volume', 'double precision', (c) => c.check(sql`liquid_molar_volume > 0`))
    .addColumn('created_by', 'text', (c) => c.references('app_user.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('row_version', 'integer', (c) => c.notNull().defaultTo(1))
    .execute()

  // `parameters` holds the correlation exactly as published (thermo's VaporPressureModel shape).
  await db.schema
    .createTable('vapor_pressure_set')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('component_id', 'uuid', (c) => c.notNull().references('component.id').onDelete('cascade'))
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('antoine', 'clausius-clapeyron')`))
    .addColumn('parameters', 'jsonb', (c) => c.notNull())
    .addColumn('range_min', 'double precision')
    .addColumn('range_max', 'double precision')
    .addColumn('range_unit', 'text', (c) => c.check(sql`range_unit in ('C', 'K')`))
    .addColumn('source', 'text', (c) => c.notNull().check(sql`length(trim(source)) > 0`))
    .addColumn('preferred', 'boolean', (c) => c.notNull().defaultTo(false))
    .addColumn('entered_by', 'text', (c) => c.references('app_user.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint(
      'vapor_pressure_range_order',
      sql`range_min is null or range_max is null or range_min < range_max`,
    )
    .execute()

  await db.schema
    .createTable('pure_measurement')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('component_id', 'uuid', (c) => c.notNull().references('component.id').onDelete('cascade'))
    .addColumn('temperature_k', 'double precision', (c) => c.notNull().check(sql`temperature_k > 0`))
    .addColumn('pressure_pa', 'double precision', (c) => c.notNull().check(sql`pressure_pa > 0`))
    .addColumn('note', 'text')
    .addColumn('measured_by', 'text', (c) => c.references('app_user.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute()

  await db.schema
    .createTable('binary_system')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('component1_id', 'uuid', (c) => c.notNull().references('component.id'))
    .addColumn('component2_id', 'uuid', (c) => c.notNull().references('component.id'))
    .addColumn('notes', 'text')
    .addColumn('created_by', 'text', (c) => c.references('app_user.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('binary_system_distinct', sql`component1_id <> component2_id`)
    .execute()
  // The pair is unique whichever way round it was entered.
  await sql`create unique index binary_system_pair on binary_system
    (least(component1_id, component2_id), greatest(component1_id, component2_id))`.execute(db)
}

async function createCalibrationTables(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('gc_method')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('name', 'text', (c) => c.notNull().unique())
    .addColumn('detector', 'text', (c) => c.notNull().check(sql`detector in ('FID', 'TCD')`))
    .addColumn('column_description', 'text')
    .addColumn('conditions', 'text')
    .addColumn('created_by', 'text', (c) => c.references('app_user.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute()

  await db.schema
    .createTable('upload')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('calibration', 'run')`))
    .addColumn('original_name', 'text', (c) => c.notNull())
    .addColumn('content_type', 'text', (c) => c.notNull())
    .addColumn('size_bytes', 'integer', (c) => c.notNull().check(sql`size_bytes >= 0`))
    .addColumn('sha256', 'text', (c) => c.notNull().check(sql`sha256 ~ '^[0-9a-f]{64}$'`))
    .addColumn('content', 'bytea', (c) => c.notNull())
    .addColumn('uploaded_by', 'text', (c) => c.notNull().references('app_user.id'))
    .addColumn('uploaded_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('upload_size_matches', sql`size_bytes = octet_length(content)`)
    .execute()

  await db.schema
    .createTable('calibration')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('gc_method_id', 'uuid', (c) => c.notNull().references('gc_method.id'))
    .addColumn('system_id', 'uuid', (c) => c.notNull().references('binary_system.id'))
    .addColumn('model', 'text', (c) => c.notNull().check(sql`model in ('response-factor', 'linear', 'quadratic')`))
    .addColumn('result', 'jsonb', (c) => c.notNull())
    .addColumn('range_min', 'double precision', (c) => c.notNull())
    .addColumn('range_max', 'double precision', (c) => c.notNull())
    .addColumn('status', 'text', (c) =>
      c
        .notNull()
        .defaultTo('active')
        .check(sql`status in ('active', 'retired')`),
    )
    .addColumn('upload_id', 'uuid', (c) => c.notNull().references('upload.id'))
    .addColumn('created_by', 'text', (c) => c.notNull().references('app_user.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('retired_at', 'timestamptz')
    .execute()
  // Exactly one calibration is "the active one" for a method and a pair at any time.
  await sql`create unique index calibration_one_active on calibration (gc_method_id, system_id)
    where status = 'active'`.execute(db)

  await db.schema
    .createTable('calibration_standard')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('calibration_id', 'uuid', (c) => c.notNull().references('calibration.id').onDelete('cascade'))
    .addColumn('label', 'text', (c) => c.notNull())
    .addColumn('basis', 'text', (c) => c.notNull().check(sql`basis in ('mole', 'mass')`))
    .addColumn('fraction1', 'double precision', (c) => c.notNull().check(sql`fraction1 >= 0 and fraction1 <= 1`))
    .addColumn('x1', 'double precision', (c) => c.notNull().check(sql`x1 >= 0 and x1 <= 1`))
    .addUniqueConstraint('calibration_standard_label', ['calibration_id', 'label'])
    .execute()

  await db.schema
    .createTable('calibration_injection')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('standard_id', 'uuid', (c) => c.notNull().references('calibration_standard.id').onDelete('cascade'))
    .addColumn('injection_no', 'integer', (c) => c.notNull())
    .addColumn('area1', 'double precision', (c) => c.notNull().check(sql`area1 > 0`))
    .addColumn('area2', 'double precision', (c) => c.notNull().check(sql`area2 > 0`))
    .addColumn('row_ref', 'integer', (c) => c.notNull())
    .execute()
}

async function createDataSetTables(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('data_set')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('lineage_id', 'uuid', (c) => c.notNull())
    .addColumn('version', 'integer', (c) =>
      c
        .notNull()
        .defaultTo(1)
        .check(sql`version >= 1`),
    )
    .addColumn('previous_version_id', 'uuid', (c) => c.references('data_set.id'))
    .addColumn('system_id', 'uuid', (c) => c.notNull().references('binary_system.id'))
    .addColumn('title', 'text', (c) => c.notNull())
    .addColumn('state', 'text', (c) =>
      c
        .notNull()
        .defaultTo('draft')
        .check(sql`state in ('draft', 'submitted', 'approved', 'returned', 'superseded')`),
    )
    .addColumn('nominal_pressure_pa', 'double precision', (c) => c.notNull().check(sql`nominal_pressure_pa > 0`))
    .addColumn('apparatus_notes', 'text')
    .addColumn('project_ref', 'text')
    .addColumn('recommended_fit_id', 'uuid')
    .addColumn('created_by', 'text', (c) => c.notNull().references('app_user.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('submitted_at', 'timestamptz')
    .addColumn('approved_at', 'timestamptz')
    .addColumn('superseded_at', 'timestamptz')
    .addColumn('row_version', 'integer', (c) => c.notNull().defaultTo(1))
    .addUniqueConstraint('data_set_lineage_version', ['lineage_id', 'version'])
    .execute()

  await db.schema
    .createTable('fit')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('data_set_id', 'uuid', (c) => c.notNull().references('data_set.id').onDelete('cascade'))
    .addColumn('model', 'text', (c) => c.notNull().check(sql`model in ('margules', 'van-laar', 'wilson', 'nrtl')`))
    .addColumn('options', 'jsonb', (c) => c.notNull())
    .addColumn('activity', 'jsonb', (c) => c.notNull())
    .addColumn('parameters', 'jsonb', (c) => c.notNull())
    .addColumn('statistics', 'jsonb', (c) => c.notNull())
    .addColumn('residuals', 'jsonb', (c) => c.notNull())
    .addColumn('point_ids', sql`uuid[]`, (c) => c.notNull())
    .addColumn('run_by', 'text', (c) => c.notNull().references('app_user.id'))
    .addColumn('run_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute()
  await sql`alter table data_set add constraint data_set_recommended_fit
    foreign key (recommended_fit_id) references fit(id) on delete set null`.execute(db)

  await db.schema
    .createTable('point')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('data_set_id', 'uuid', (c) => c.notNull().references('data_set.id').onDelete('cascade'))
    .addColumn('seq', 'integer', (c) => c.notNull())
    .addColumn('sample_label', 'text', (c) => c.notNull())
    .addColumn('temperature_k', 'double precision', (c) => c.notNull().check(sql`temperature_k > 0`))
    .addColumn('pressure_pa', 'double precision', (c) => c.notNull().check(sql`pressure_pa > 0`))
    .addColumn('x1', 'double precision', (c) => c.notNull().check(sql`x1 >= 0 and x1 <= 1`))
    .addColumn('x1_uncertainty', 'double precision', (c) => c.notNull())
    .addColumn('y1', 'double precision', (c) => c.notNull().check(sql`y1 >= 0 and y1 <= 1`))
    .addColumn('y1_uncertainty', 'double precision', (c) => c.notNull())
    .addColumn('excluded', 'boolean', (c) => c.notNull().defaultTo(false))
    .addColumn('exclusion_reason', 'text')
    .addColumn('upload_id', 'uuid', (c) => c.references('upload.id'))
    .addColumn('calibration_id', 'uuid', (c) => c.references('calibration.id'))
    .addColumn('row_refs', sql`integer[]`, (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint(
      'point_exclusion_reason',
      sql`not excluded or (exclusion_reason is not null and length(trim(exclusion_reason)) > 0)`,
    )
    .addUniqueConstraint('point_seq', ['data_set_id', 'seq'])
    .execute()

  await db.schema
    .createTable('point_injection')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('point_id', 'uuid', (c) => c.notNull().references('point.id').onDelete('cascade'))
    .addColumn('phase', 'text', (c) => c.notNull().check(sql`phase in ('liquid', 'vapour')`))
    .addColumn('injection_no', 'integer', (c) => c.notNull())
    .addColumn('area1', 'double precision', (c) => c.notNull().check(sql`area1 > 0`))
    .addColumn('area2', 'double precision', (c) => c.notNull().check(sql`area2 > 0`))
    .addColumn('row_ref', 'integer', (c) => c.notNull())
    .execute()
  await sql`create index point_injection_point on point_injection (point_id)`.execute(db)

  await db.schema
    .createTable('consistency_result')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('data_set_id', 'uuid', (c) => c.notNull().references('data_set.id').onDelete('cascade'))
    .addColumn('test', 'text', (c) => c.notNull().check(sql`test in ('herington-area', 'point')`))
    .addColumn('passed', 'boolean', (c) => c.notNull())
    .addColumn('result', 'jsonb', (c) => c.notNull())
    .addColumn('run_by', 'text', (c) => c.notNull().references('app_user.id'))
    .addColumn('run_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute()

  // Which uploads fed which data set (calibration uploads have none).
  await db.schema
    .alterTable('upload')
    .addColumn('data_set_id', 'uuid', (c) => c.references('data_set.id').onDelete('cascade'))
    .execute()
  await sql`create index point_data_set on point (data_set_id)`.execute(db)
  await sql`create index data_set_state on data_set (state, system_id)`.execute(db)
}

async function createReviewTables(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('comment')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('data_set_id', 'uuid', (c) => c.notNull().references('data_set.id').onDelete('cascade'))
    .addColumn('point_id', 'uuid', (c) => c.references('point.id').onDelete('set null'))
    .addColumn('parent_id', 'uuid', (c) => c.references('comment.id').onDelete('cascade'))
    .addColumn('author_id', 'text', (c) => c.notNull().references('app_user.id'))
    .addColumn('body', 'text', (c) => c.notNull().check(sql`length(trim(body)) > 0`))
    .addColumn('resolved', 'boolean', (c) => c.notNull().defaultTo(false))
    .addColumn('resolved_by', 'text', (c) => c.references('app_user.id'))
    .addColumn('resolved_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute()

  await db.schema
    .createTable('approval')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('data_set_id', 'uuid', (c) => c.notNull().references('data_set.id'))
    .addColumn('signer_id', 'text', (c) => c.notNull().references('app_user.id'))
    .addColumn('meaning', 'text', (c) => c.notNull().check(sql`meaning in ('approved', 'returned for rework')`))
    .addColumn('reason', 'text', (c) => c.notNull().check(sql`length(trim(reason)) > 0`))
    .addColumn('digest', 'text', (c) => c.notNull().check(sql`digest ~ '^[0-9a-f]{64}$'`))
    .addColumn('self_approval', 'boolean', (c) => c.notNull().defaultTo(false))
    .addColumn('override_reason', 'text')
    .addColumn('signed_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute()

  await db.schema
    .createTable('audit_log')
    .addColumn('id', 'bigint', (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn('at', 'timestamptz', (c) => c.notNull().defaultTo(sql`clock_timestamp()`))
    .addColumn('actor_id', 'text', (c) => c.references('app_user.id'))
    .addColumn('entity', 'text', (c) => c.notNull())
    .addColumn('entity_id', 'text', (c) => c.notNull())
    .addColumn('action', 'text', (c) => c.notNull())
    .addColumn('data_set_id', 'uuid')
    .addColumn('before', 'jsonb')
    .addColumn('after', 'jsonb')
    .execute()
  await sql`create index audit_log_data_set on audit_log (data_set_id, id)`.execute(db)
}

async function createTriggers(db: Kysely<any>): Promise<void> {
  await sql`
    create function lab_reject_change() returns trigger language plpgsql as $$
    begin
      raise exception '% rows are append-only: % is not allowed', TG_TABLE_NAME, TG_OP
        using errcode = 'P0001';
    end $$`.execute(db)
  for (const table of ['audit_log', 'approval']) {
    await sql`create trigger ${sql.raw(table + '_append_only')} before update or delete on ${sql.table(table)}
      for each row execute function lab_reject_change()`.execute(db)
  }

  // An approved version may only move to 'superseded' (nothing else changes); superseded is final.
  await sql`
    create function lab_data_set_guard() returns trigger language plpgsql as $$
    begin
      if TG_OP = 'DELETE' then
        if OLD.state in ('approved', 'superseded') then
          raise exception 'data set % is % and cannot be deleted', OLD.id, OLD.state using errcode = 'P0002';
        end if;
        return OLD;
      end if;
      if OLD.state = 'approved' and NEW.state = 'superseded'
         and (to_jsonb(NEW) - array['state', 'superseded_at', 'updated_at', 'row_version'])
           = (to_jsonb(OLD) - array['state', 'superseded_at', 'updated_at', 'row_version']) then
        return NEW;
      end if;
      if OLD.state in ('approved', 'superseded') then
        raise exception 'data set % is % and cannot be changed', OLD.id, OLD.state using errcode = 'P0002';
      end if;
      return NEW;
    end $$`.execute(db)
  await sql`create trigger data_set_immutable before update or delete on data_set
    for each row execute function lab_data_set_guard()`.execute(db)

  // Points, their injections, fits and consistency results of an approved version are frozen.
  await sql`
    create function lab_child_guard() returns trigger language plpgsql as $$
    declare ds uuid; st text;
    begin
      if TG_TABLE_NAME = 'point_injection' then
        select p.data_set_id into ds from point p
          where p.id = (case when TG_OP = 'DELETE' then OLD.point_id else NEW.point_id end);
      elsif TG_OP = 'DELETE' then
        ds := OLD.data_set_id;
      else
        ds := NEW.data_set_id;
      end if;
      select state into st from data_set where id = ds;
      if st in ('approved', 'superseded') then
        raise exception '% of data set % cannot be changed: the data set is %', TG_TABLE_NAME, ds, st
          using errcode = 'P0002';
      end if;
      if TG_OP = 'DELETE' then return OLD; end if;
      return NEW;
    end $$`.execute(db)
  for (const table of ['point', 'point_injection', 'fit', 'consistency_result']) {
    await sql`create trigger ${sql.raw(table + '_frozen')} before insert or update or delete on ${sql.table(table)}
      for each row execute function lab_child_guard()`.execute(db)
  }
}
