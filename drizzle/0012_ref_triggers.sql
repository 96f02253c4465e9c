-- The references of episode, assessment, score and episode_intervention (dropped as foreign keys in 0011), enforced
-- by statement-level triggers. A foreign key checks and locks its parent once per child row (about 1.3 million
-- checks for a 100,000-row upload); these check once per statement and lock each distinct parent once.
-- Same rules as the foreign keys: a child needs a visible parent (checked at the end of the statement); deleting
-- an episode or assessment deletes its children; deleting or re-keying a referenced clinic, condition, instrument,
-- intervention code or user, or re-keying an episode or assessment, is refused (SQLSTATE 23503 as for a foreign key).
--
-- Concurrency: the child check takes FOR KEY SHARE on every parent that existed before this transaction, as a
-- foreign key does, so a concurrent delete of that parent waits for this commit (and then cascades to, or is
-- refused by, the committed children). Rows this transaction inserted itself (xmin = its id) are not locked:
-- no other transaction can see them, so none can delete them; a row it updated is already locked by the update.
-- The parent triggers read the children with a fresh snapshot, which READ COMMITTED gives each statement; under
-- REPEATABLE READ or SERIALIZABLE they could miss children committed meanwhile (where a foreign key reports a
-- serialization failure), so there they refuse deletes and key changes instead. The app deletes parents only at
-- READ COMMITTED (the default).
CREATE FUNCTION "ref_check_parents"() RETURNS trigger LANGUAGE plpgsql AS $fn$
DECLARE
  col text := TG_ARGV[0];
  parent text := TG_ARGV[1];
  pkey text := TG_ARGV[2];
  me xid := pg_current_xact_id()::xid;
  keys text;
  wanted bigint;
  own bigint;
  others bigint;
  missing text;
BEGIN
  -- The distinct parent keys the statement brought in (for an update only keys that changed, as a foreign key does).
  keys := CASE WHEN TG_OP = 'INSERT'
    THEN format('SELECT DISTINCT %1$I AS k FROM new_rows WHERE %1$I IS NOT NULL', col)
    ELSE format('SELECT %1$I AS k FROM new_rows WHERE %1$I IS NOT NULL EXCEPT SELECT %1$I FROM old_rows', col) END;
  EXECUTE format('SELECT count(*), count(p.xmin) FILTER (WHERE p.xmin = $1), count(p.xmin) FILTER (WHERE p.xmin <> $1)
    FROM (%s) d LEFT JOIN %I p ON p.%I = d.k', keys, parent, pkey) INTO wanted, own, others USING me;
  IF others > 0 OR own < wanted THEN
    -- Lock, then count again: a parent locked here cannot go away before this transaction ends (one that was
    -- missing above but committed since is locked and counted too). Own rows stay as counted.
    EXECUTE format('SELECT count(*) FROM (SELECT 1 FROM (%s) d JOIN %I p ON p.%I = d.k WHERE p.xmin <> $1 FOR KEY SHARE OF p) x', keys, parent, pkey)
      INTO others USING me;
  END IF;
  IF own + others < wanted THEN
    EXECUTE format('SELECT d.k::text FROM (%s) d WHERE NOT EXISTS (SELECT 1 FROM %I p WHERE p.%I = d.k) LIMIT 1', keys, parent, pkey) INTO missing;
    RAISE EXCEPTION 'insert or update on table "%" violates foreign key constraint "%"', TG_TABLE_NAME, TG_NAME
      USING ERRCODE = 'foreign_key_violation', TABLE = TG_TABLE_NAME, CONSTRAINT = TG_NAME,
        DETAIL = format('Key (%s)=(%s) is not present in table "%s".', col, coalesce(missing, '?'), parent);
  END IF;
  RETURN NULL;
END;
$fn$;
--> statement-breakpoint
CREATE FUNCTION "ref_needs_read_committed"() RETURNS void LANGUAGE plpgsql AS $fn$
BEGIN
  IF current_setting('transaction_isolation') <> 'read committed' THEN
    RAISE EXCEPTION 'deleting or re-keying a referenced row needs READ COMMITTED isolation (its children are checked with a fresh snapshot)'
      USING ERRCODE = 'serialization_failure';
  END IF;
END;
$fn$;
--> statement-breakpoint
-- ON DELETE CASCADE: TG_ARGV = child table, child column, parent key.
CREATE FUNCTION "ref_cascade_delete"() RETURNS trigger LANGUAGE plpgsql AS $fn$
BEGIN
  PERFORM "ref_needs_read_committed"();
  EXECUTE format('DELETE FROM %I c WHERE c.%I IN (SELECT %I FROM old_rows)', TG_ARGV[0], TG_ARGV[1], TG_ARGV[2]);
  RETURN NULL;
END;
$fn$;
--> statement-breakpoint
-- NO ACTION on delete, and on a change of the key for every reference: TG_ARGV = child table, child column, parent key.
CREATE FUNCTION "ref_restrict"() RETURNS trigger LANGUAGE plpgsql AS $fn$
DECLARE
  child text := TG_ARGV[0];
  col text := TG_ARGV[1];
  pkey text := TG_ARGV[2];
  gone text;
  used text;
BEGIN
  gone := CASE WHEN TG_OP = 'DELETE'
    THEN format('SELECT %I AS k FROM old_rows', pkey)
    ELSE format('SELECT %1$I AS k FROM old_rows EXCEPT SELECT %1$I FROM new_rows', pkey) END;
  IF TG_OP = 'UPDATE' THEN
    EXECUTE format('SELECT k::text FROM (%s) g LIMIT 1', gone) INTO used;
    IF used IS NULL THEN RETURN NULL; END IF; -- no key changed (the usual update)
  END IF;
  PERFORM "ref_needs_read_committed"();
  EXECUTE format('SELECT g.k::text FROM (%s) g WHERE EXISTS (SELECT 1 FROM %I c WHERE c.%I = g.k) LIMIT 1', gone, child, col) INTO used;
  IF used IS NOT NULL THEN
    RAISE EXCEPTION 'update or delete on table "%" violates foreign key constraint "%" on table "%"', TG_TABLE_NAME, TG_NAME, child
      USING ERRCODE = 'foreign_key_violation', TABLE = TG_TABLE_NAME, CONSTRAINT = TG_NAME,
        DETAIL = format('Key (%s)=(%s) is still referenced from table "%s".', pkey, used, child);
  END IF;
  RETURN NULL;
END;
$fn$;
--> statement-breakpoint
-- TRUNCATE of a parent leaves no orphans: refused while the child has rows (truncating both at once is fine).
CREATE FUNCTION "ref_restrict_truncate"() RETURNS trigger LANGUAGE plpgsql AS $fn$
DECLARE
  orphans boolean;
BEGIN
  EXECUTE format('SELECT EXISTS (SELECT 1 FROM %I)', TG_ARGV[0]) INTO orphans;
  IF orphans THEN
    RAISE EXCEPTION 'cannot truncate table "%" while table "%" references it; truncate both together', TG_TABLE_NAME, TG_ARGV[0]
      USING ERRCODE = 'foreign_key_violation';
  END IF;
  RETURN NULL;
END;
$fn$;
--> statement-breakpoint
DO $$
DECLARE
  r record;
BEGIN
  -- child, column, parent, parent key, on delete
  FOR r IN SELECT * FROM (VALUES
    ('episode', 'clinic_id', 'clinic', 'id', 'restrict'),
    ('episode', 'condition_code', 'condition', 'code', 'restrict'),
    ('episode', 'created_by', 'app_user', 'id', 'restrict'),
    ('episode', 'updated_by', 'app_user', 'id', 'restrict'),
    ('assessment', 'episode_id', 'episode', 'id', 'cascade'),
    ('assessment', 'created_by', 'app_user', 'id', 'restrict'),
    ('score', 'assessment_id', 'assessment', 'id', 'cascade'),
    ('score', 'instrument_id', 'instrument', 'id', 'restrict'),
    ('episode_intervention', 'episode_id', 'episode', 'id', 'cascade'),
    ('episode_intervention', 'intervention_code_id', 'intervention_code', 'id', 'restrict')
  ) AS v(child, col, parent, pkey, on_delete) LOOP
    EXECUTE format('CREATE TRIGGER %I AFTER INSERT ON %I REFERENCING NEW TABLE AS new_rows
      FOR EACH STATEMENT EXECUTE FUNCTION "ref_check_parents"(%L, %L, %L)', r.child || '_' || r.col || '_ref_insert', r.child, r.col, r.parent, r.pkey);
    EXECUTE format('CREATE TRIGGER %I AFTER UPDATE ON %I REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows
      FOR EACH STATEMENT EXECUTE FUNCTION "ref_check_parents"(%L, %L, %L)', r.child || '_' || r.col || '_ref_update', r.child, r.col, r.parent, r.pkey);
    EXECUTE format('CREATE TRIGGER %I AFTER DELETE ON %I REFERENCING OLD TABLE AS old_rows
      FOR EACH STATEMENT EXECUTE FUNCTION %I(%L, %L, %L)', r.child || '_' || r.col || '_ref_delete', r.parent,
      CASE r.on_delete WHEN 'cascade' THEN 'ref_cascade_delete' ELSE 'ref_restrict' END, r.child, r.col, r.pkey);
    EXECUTE format('CREATE TRIGGER %I AFTER UPDATE ON %I REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows
      FOR EACH STATEMENT EXECUTE FUNCTION "ref_restrict"(%L, %L, %L)', r.child || '_' || r.col || '_ref_rekey', r.parent, r.child, r.col, r.pkey);
    EXECUTE format('CREATE TRIGGER %I AFTER TRUNCATE ON %I
      FOR EACH STATEMENT EXECUTE FUNCTION "ref_restrict_truncate"(%L)', r.child || '_' || r.col || '_ref_truncate', r.parent, r.child);
  END LOOP;
END;
$$;
--> statement-breakpoint
-- Rows written before this migration were checked by the foreign keys; say so again, in case.
DO $$
BEGIN
  IF EXISTS (SELECT 1 FROM episode c WHERE NOT EXISTS (SELECT 1 FROM clinic p WHERE p.id = c.clinic_id))
    OR EXISTS (SELECT 1 FROM assessment c WHERE NOT EXISTS (SELECT 1 FROM episode p WHERE p.id = c.episode_id))
    OR EXISTS (SELECT 1 FROM score c WHERE NOT EXISTS (SELECT 1 FROM assessment p WHERE p.id = c.assessment_id))
    OR EXISTS (SELECT 1 FROM episode_intervention c WHERE NOT EXISTS (SELECT 1 FROM episode p WHERE p.id = c.episode_id)) THEN
    RAISE EXCEPTION 'orphaned child rows found; the migration stops';
  END IF;
END;
$$;
