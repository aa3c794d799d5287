CREATE TABLE "rollup_field_latest" (
	"field_id" integer PRIMARY KEY NOT NULL,
	"check_id" integer NOT NULL,
	"checked_on" date NOT NULL,
	"score" real NOT NULL
);
