import { sql, type Kysely } from 'kysely'

/**
 * A system's joint parameter sets: one activity-model parameter set fitted over several data sets of one binary
 * system (different pressures or temperatures), with the digest of each contributing data set's point set, the
 * covariance, per-data-set statistics and the temperature/pressure range it covers. A lead chemist runs and
 * submits one; another lead chemist signs it as the system's recommended parameter set (append-only
 * signatures); approving a newer one supersedes the older, which stays in the record.
 * Rules that must hold whatever the app does live here: a signed (approved or superseded) set never changes
 * except approved → superseded, only drafts may be deleted, members never change, signatures are append-only.
 * Frozen in time: never import app code here.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('joint_fit')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('system_id', 'uuid', (c) => c.notNull().references('binary_system.id'))
    .addColumn('model', 'text', (c) => c.notNull().check(sql`model in ('nrtl', 'wilson')`))
    .addColumn('options', 'jsonb', (c) => c.notNull())
    .addColumn('activity', 'jsonb', (c) => c.notNull())
    .addColumn('parameters', 'jsonb', (c) => c.notNull())
    .addColumn('statistics', 'jsonb', (c) => c.notNull())
    .addColumn('t_min_k', 'double precision', (c) => c.notNull())
    .addColumn('t_max_k', 'double precision', (c) => c.notNull())
    .addColumn('p_min_pa', 'double precision', (c) => c.notNull().check(sql`p_min_pa > 0`))
    .addColumn('p_max_pa', 'double precision', (c) => c.notNull())
    .addColumn('state', 'text', (c) =>
      c
        .notNull()
        .defaultTo('draft')
        .check(sql`state in ('draft', 'submitted', 'approved', 'superseded')`),
    )
    .addColumn('run_by', 'text', (c) => c.notNull().references('app_user.id'))
    .addColumn('run_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('submitted_by', 'text', (c) => c.references('app_user.id'))
    .addColumn('submitted_at', 'timestamptz')
    .addColumn('approved_at', 'timestamptz')
    .addColumn('superseded_at', 'timestamptz')
    .addColumn('superseded_by', 'uuid')
    .addColumn('row_version', 'integer', (c) => c.notNull().defaultTo(1))
    .addCheckConstraint('joint_fit_range', sql`t_min_k <= t_max_k and p_min_pa <= p_max_pa`)
    .execute()
  await sql`create index joint_fit_system on joint_fit (system_id, state)`.execute(db)
  // At most one recommended (approved) set per system.
  await sql`create unique index joint_fit_one_recommended on joint_fit (system_id) where state = 'approved'`.execute(db)

  await db.schema
    .createTable('joint_fit_member')
    .addColumn('joint_fit_id', 'uuid', (c) => c.notNull().references('joint_fit.id').onDelete('cascade'))
    .addColumn('data_set_id', 'uuid', (c) => c.notNull().references('data_set.id'))
    .addColumn('position', 'integer', (c) => c.notNull())
    .addColumn('point_set_digest', 'text', (c) => c.notNull())
    .addColumn('point_count', 'integer', (c) => c.notNull())
    /** The data set's statistics under the joint parameters (n, rmsT, rmsY, biasT, biasY, T and P ranges). */
    .addColumn('statistics', 'jsonb', (c) => c.notNull())
    .addPrimaryKeyConstraint('joint_fit_member_pk', ['joint_fit_id', 'data_set_id'])
    .execute()
  await sql`create index joint_fit_member_data_set on joint_fit_member (data_set_id)`.execute(db)

  await db.schema
    .createTable('joint_fit_approval')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('joint_fit_id', 'uuid', (c) => c.notNull().references('joint_fit.id'))
    .addColumn('signer_id', 'text', (c) => c.notNull().references('app_user.id'))
    .addColumn('meaning', 'text', (c) => c.notNull().check(sql`meaning in ('approved')`))
    .addColumn('reason', 'text', (c) => c.notNull().check(sql`length(trim(reason)) > 0`))
    .addColumn('digest', 'text', (c) => c.notNull().check(sql`digest ~ '^[0-9a-f]{64}$'`))
    .addColumn('digest_algorithm', 'text', (c) => c.notNull())
    .addColumn('changes', 'jsonb', (c) => c.notNull())
    .addColumn('self_approval', 'boolean', (c) => c.notNull().defaultTo(false))
    .addColumn('signed_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute()
  await sql`create trigger joint_fit_approval_append_only before update or delete on joint_fit_approval
    for each row execute function lab_reject_change()`.execute(db)

  await sql`
    create function lab_joint_fit_guard() returns trigger language plpgsql as $$
    begin
      if TG_OP = 'DELETE' then
        if OLD.state <> 'draft' then
          raise exception 'joint fit % is % and cannot be deleted', OLD.id, OLD.state using errcode = 'P0002';
        end if;
        return OLD;
      end if;
      if OLD.state = 'approved' and NEW.state = 'superseded'
         and (to_jsonb(NEW) - array['state', 'superseded_at', 'superseded_by', 'row_version'])
           = (to_jsonb(OLD) - array['state', 'superseded_at', 'superseded_by', 'row_version']) then
        return NEW;
      end if;
      if OLD.state in ('approved', 'superseded') then
        raise exception 'joint fit % is % and cannot be changed', OLD.id, OLD.state using errcode = 'P0002';
      end if;
      if (to_jsonb(NEW) - array['state', 'submitted_by', 'submitted_at', 'approved_at', 'row_version'])
         <> (to_jsonb(OLD) - array['state', 'submitted_by', 'submitted_at', 'approved_at', 'row_version']) then
        raise exception 'the result of joint fit % cannot be changed', OLD.id using errcode = 'P0002';
      end if;
      return NEW;
    end $$`.execute(db)
  await sql`create trigger joint_fit_guard before update or delete on joint_fit
    for each row execute function lab_joint_fit_guard()`.execute(db)

  // Members are written once with their fit; they go only with a deleted draft.
  await sql`
    create function lab_joint_fit_member_guard() returns trigger language plpgsql as $$
    declare st text;
    begin
      if TG_OP = 'UPDATE' then
        raise exception 'joint fit members cannot be changed' using errcode = 'P0002';
      end if;
      select state into st from joint_fit where id = OLD.joint_fit_id;
      if st is not null and st <> 'draft' then
        raise exception 'members of joint fit % cannot be removed: it is %', OLD.joint_fit_id, st using errcode = 'P0002';
      end if;
      return OLD;
    end $$`.execute(db)
  await sql`create trigger joint_fit_member_frozen before update or delete on joint_fit_member
    for each row execute function lab_joint_fit_member_guard()`.execute(db)
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('joint_fit_approval').execute()
  await db.schema.dropTable('joint_fit_member').execute()
  await db.schema.dropTable('joint_fit').execute()
  await sql`drop function if exists lab_joint_fit_guard cascade`.execute(db)
  await sql`drop function if exists lab_joint_fit_member_guard cascade`.execute(db)
}
