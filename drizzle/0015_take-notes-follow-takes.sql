ALTER TABLE "take_notes" DROP CONSTRAINT "take_notes_take_id_takes_id_fk";
--> statement-breakpoint
-- A deleted take's notes go with it, in one statement however many takes went (a take's delete,
-- or every take of a removed account); their own delete trigger takes them out of the maps.
CREATE FUNCTION takes_delete_notes() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  DELETE FROM take_notes WHERE take_id IN (SELECT id FROM old_takes);
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE TRIGGER takes_delete_notes AFTER DELETE ON takes
  REFERENCING OLD TABLE AS old_takes FOR EACH STATEMENT EXECUTE FUNCTION takes_delete_notes();
