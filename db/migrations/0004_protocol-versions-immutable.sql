-- A run cites a protocol version by id; if that row could change, the run's method would change under it.
-- Editing a protocol appends a version, so no UPDATE of this table is ever legitimate.
CREATE FUNCTION protocol_versions_refuse_update() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'protocol_versions rows are immutable: append a new version instead'
    USING ERRCODE = 'restrict_violation';
END;
$$;--> statement-breakpoint
CREATE TRIGGER protocol_versions_immutable
  BEFORE UPDATE ON protocol_versions
  FOR EACH ROW EXECUTE FUNCTION protocol_versions_refuse_update();
