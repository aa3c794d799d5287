-- The sites compare is cached behind the change counters too; besides the tables counted
-- already it reads the applications (seed sown) and the equipment (each machine's kind).
INSERT INTO answer_versions (scope, version) VALUES ('applications', 0), ('equipment', 0) ON CONFLICT (scope) DO NOTHING;
--> statement-breakpoint
CREATE TRIGGER answer_version_applications AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "applications" FOR EACH STATEMENT EXECUTE FUNCTION answer_version_bump();
--> statement-breakpoint
CREATE TRIGGER answer_version_equipment AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "equipment" FOR EACH STATEMENT EXECUTE FUNCTION answer_version_bump();
