CREATE TABLE "shop_fills" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"circuit_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"volume_l" double precision NOT NULL,
	"estimate_l" double precision NOT NULL,
	"entered_unit" text NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"recorded_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "shop_lines" (
	"workshop_id" uuid NOT NULL,
	"circuit_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"line_id" text NOT NULL,
	"custom" jsonb,
	"price" double precision,
	"supplier" text,
	"bought_at" timestamp with time zone,
	"bought_by" uuid,
	"fitted_at" timestamp with time zone,
	"fitted_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "shop_lines_circuit_id_version_line_id_pk" PRIMARY KEY("circuit_id","version","line_id")
);
--> statement-breakpoint
CREATE TABLE "shop_pressure_tests" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"circuit_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"start_kpa" double precision NOT NULL,
	"end_kpa" double precision NOT NULL,
	"minutes_held" double precision NOT NULL,
	"passed" boolean NOT NULL,
	"entered_unit" text NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"recorded_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "shop_steps" (
	"workshop_id" uuid NOT NULL,
	"circuit_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"step_id" text NOT NULL,
	"done_by" uuid,
	"done_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "shop_steps_circuit_id_version_step_id_pk" PRIMARY KEY("circuit_id","version","step_id")
);
--> statement-breakpoint
ALTER TABLE "shop_fills" ADD CONSTRAINT "shop_fills_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shop_fills" ADD CONSTRAINT "shop_fills_circuit_id_circuits_id_fk" FOREIGN KEY ("circuit_id") REFERENCES "public"."circuits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shop_fills" ADD CONSTRAINT "shop_fills_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shop_fills" ADD CONSTRAINT "shop_fills_circuit_id_version_circuit_revisions_circuit_id_version_fk" FOREIGN KEY ("circuit_id","version") REFERENCES "public"."circuit_revisions"("circuit_id","version") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shop_lines" ADD CONSTRAINT "shop_lines_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shop_lines" ADD CONSTRAINT "shop_lines_circuit_id_circuits_id_fk" FOREIGN KEY ("circuit_id") REFERENCES "public"."circuits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shop_lines" ADD CONSTRAINT "shop_lines_bought_by_users_id_fk" FOREIGN KEY ("bought_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shop_lines" ADD CONSTRAINT "shop_lines_fitted_by_users_id_fk" FOREIGN KEY ("fitted_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shop_lines" ADD CONSTRAINT "shop_lines_circuit_id_version_circuit_revisions_circuit_id_version_fk" FOREIGN KEY ("circuit_id","version") REFERENCES "public"."circuit_revisions"("circuit_id","version") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shop_pressure_tests" ADD CONSTRAINT "shop_pressure_tests_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shop_pressure_tests" ADD CONSTRAINT "shop_pressure_tests_circuit_id_circuits_id_fk" FOREIGN KEY ("circuit_id") REFERENCES "public"."circuits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shop_pressure_tests" ADD CONSTRAINT "shop_pressure_tests_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shop_pressure_tests" ADD CONSTRAINT "shop_pressure_tests_circuit_id_version_circuit_revisions_circuit_id_version_fk" FOREIGN KEY ("circuit_id","version") REFERENCES "public"."circuit_revisions"("circuit_id","version") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shop_steps" ADD CONSTRAINT "shop_steps_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shop_steps" ADD CONSTRAINT "shop_steps_circuit_id_circuits_id_fk" FOREIGN KEY ("circuit_id") REFERENCES "public"."circuits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shop_steps" ADD CONSTRAINT "shop_steps_done_by_users_id_fk" FOREIGN KEY ("done_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shop_steps" ADD CONSTRAINT "shop_steps_circuit_id_version_circuit_revisions_circuit_id_version_fk" FOREIGN KEY ("circuit_id","version") REFERENCES "public"."circuit_revisions"("circuit_id","version") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "shop_fills_version" ON "shop_fills" USING btree ("circuit_id","version","created_at");--> statement-breakpoint
CREATE INDEX "shop_lines_workshop" ON "shop_lines" USING btree ("workshop_id");--> statement-breakpoint
CREATE INDEX "shop_pressure_tests_version" ON "shop_pressure_tests" USING btree ("circuit_id","version","created_at");