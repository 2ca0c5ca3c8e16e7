import { type Kysely, sql } from 'kysely'

/**
 * A component without a CAS number must pass the CAS check: 20261201_02's lab_cas_valid raised
 * "upper bound of FOR loop cannot be null" for NULL instead of letting the CHECK pass.
 * Frozen in time: never import app code here.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create or replace function lab_cas_valid(cas text) returns boolean language plpgsql immutable as $$
    declare digits text; total int := 0; i int; n int;
    begin
      if cas is null then return true; end if;
      if cas !~ '^[0-9]{2,7}-[0-9]{2}-[0-9]$' then return false; end if;
      digits := replace(cas, '-', '');
      n := length(digits);
      for i in 1..(n - 1) loop
        total := total + (n - i) * substr(digits, i, 1)::int;
      end loop;
      return total % 10 = substr(digits, n, 1)::int;
    end $$`.execute(db)
}

export async function down(_db: Kysely<any>): Promise<void> {
  // The earlier definition was wrong for NULL; going down keeps the corrected function.
}
