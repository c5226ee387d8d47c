CREATE TABLE "take_notes" (
	"take_id" uuid NOT NULL,
	"idx" integer NOT NULL,
	"player_id" uuid NOT NULL,
	"midi" smallint NOT NULL,
	"beat" real NOT NULL,
	"measure" smallint NOT NULL,
	"position" real NOT NULL,
	"meter" text NOT NULL,
	"verdict" text NOT NULL,
	"offset_ms" real,
	"key" text NOT NULL,
	"pattern" text NOT NULL,
	"pair" text NOT NULL,
	"instrument" text NOT NULL,
	"played_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
CREATE TABLE "takes" (
	"id" uuid PRIMARY KEY NOT NULL,
	"player_id" uuid NOT NULL,
	"assignment_id" uuid,
	"spec" jsonb NOT NULL,
	"options" jsonb NOT NULL,
	"measure_from" smallint,
	"measure_to" smallint,
	"stopped_at_ms" real,
	"played" jsonb NOT NULL,
	"score" jsonb NOT NULL,
	"key" text NOT NULL,
	"pattern" text NOT NULL,
	"pair" text NOT NULL,
	"instrument" text NOT NULL,
	"tempo" real NOT NULL,
	"accuracy" real NOT NULL,
	"mean_offset_ms" real,
	"note_count" integer NOT NULL,
	"started_at" timestamp with time zone NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "take_notes" ADD CONSTRAINT "take_notes_take_id_takes_id_fk" FOREIGN KEY ("take_id") REFERENCES "public"."takes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "takes" ADD CONSTRAINT "takes_player_id_users_id_fk" FOREIGN KEY ("player_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "take_notes_take_idx" ON "take_notes" USING btree ("take_id","idx");--> statement-breakpoint
CREATE INDEX "take_notes_player_time_idx" ON "take_notes" USING btree ("player_id","played_at");--> statement-breakpoint
CREATE INDEX "takes_player_started_idx" ON "takes" USING btree ("player_id","started_at");--> statement-breakpoint
CREATE INDEX "takes_assignment_idx" ON "takes" USING btree ("assignment_id");