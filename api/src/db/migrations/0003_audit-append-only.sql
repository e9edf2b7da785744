-- Audit rows are append-only: any UPDATE, DELETE or TRUNCATE raises, whoever the caller is.
-- A table owner can still disable the trigger on purpose; the hash chain then shows the change.
CREATE OR REPLACE FUNCTION audit_entries_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'audit_entries is append-only: % is not allowed', TG_OP
    USING ERRCODE = 'insufficient_privilege';
END;
$$;--> statement-breakpoint
CREATE TRIGGER audit_entries_no_update_or_delete
  BEFORE UPDATE OR DELETE ON audit_entries
  FOR EACH ROW EXECUTE FUNCTION audit_entries_refuse_change();--> statement-breakpoint
CREATE TRIGGER audit_entries_no_truncate
  BEFORE TRUNCATE ON audit_entries
  FOR EACH STATEMENT EXECUTE FUNCTION audit_entries_refuse_change();
