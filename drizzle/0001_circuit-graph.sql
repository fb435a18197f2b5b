CREATE TABLE "circuit_components" (
	"circuit_id" uuid NOT NULL,
	"workshop_id" uuid NOT NULL,
	"id" text NOT NULL,
	"position" integer NOT NULL,
	"type" text NOT NULL,
	"label" text NOT NULL,
	"x" double precision NOT NULL,
	"y" double precision NOT NULL,
	"z" double precision NOT NULL,
	"rotation_deg" double precision NOT NULL,
	"volume_l" double precision NOT NULL,
	"params" jsonb NOT NULL,
	CONSTRAINT "circuit_components_circuit_id_id_pk" PRIMARY KEY("circuit_id","id")
);
--> statement-breakpoint
CREATE TABLE "circuit_hoses" (
	"circuit_id" uuid NOT NULL,
	"workshop_id" uuid NOT NULL,
	"id" text NOT NULL,
	"position" integer NOT NULL,
	"from_port_id" text,
	"from_point" jsonb,
	"from_clamp" text NOT NULL,
	"to_port_id" text,
	"to_point" jsonb,
	"to_clamp" text NOT NULL,
	"inside_diameter_mm" double precision NOT NULL,
	"wall_mm" double precision NOT NULL,
	"material" text NOT NULL,
	"measured_length_mm" double precision,
	"params" jsonb NOT NULL,
	CONSTRAINT "circuit_hoses_circuit_id_id_pk" PRIMARY KEY("circuit_id","id")
);
--> statement-breakpoint
CREATE TABLE "circuit_ports" (
	"circuit_id" uuid NOT NULL,
	"workshop_id" uuid NOT NULL,
	"id" text NOT NULL,
	"component_id" text NOT NULL,
	"position" integer NOT NULL,
	"name" text NOT NULL,
	"role" text NOT NULL,
	"spigot_od_mm" double precision NOT NULL,
	"offset_x" double precision NOT NULL,
	"offset_y" double precision NOT NULL,
	"offset_z" double precision NOT NULL,
	"blocked" boolean NOT NULL,
	CONSTRAINT "circuit_ports_circuit_id_id_pk" PRIMARY KEY("circuit_id","id")
);
--> statement-breakpoint
CREATE TABLE "circuit_revisions" (
	"circuit_id" uuid NOT NULL,
	"workshop_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"document" jsonb NOT NULL,
	"summary" jsonb NOT NULL,
	"saved_by" uuid,
	"saved_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "circuit_revisions_circuit_id_version_pk" PRIMARY KEY("circuit_id","version")
);
--> statement-breakpoint
ALTER TABLE "circuits" ADD COLUMN "settings" jsonb;--> statement-breakpoint
ALTER TABLE "circuits" ADD COLUMN "notes" text;--> statement-breakpoint
ALTER TABLE "circuit_components" ADD CONSTRAINT "circuit_components_circuit_id_circuits_id_fk" FOREIGN KEY ("circuit_id") REFERENCES "public"."circuits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "circuit_components" ADD CONSTRAINT "circuit_components_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "circuit_hoses" ADD CONSTRAINT "circuit_hoses_circuit_id_circuits_id_fk" FOREIGN KEY ("circuit_id") REFERENCES "public"."circuits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "circuit_hoses" ADD CONSTRAINT "circuit_hoses_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "circuit_hoses" ADD CONSTRAINT "circuit_hoses_circuit_id_from_port_id_circuit_ports_circuit_id_id_fk" FOREIGN KEY ("circuit_id","from_port_id") REFERENCES "public"."circuit_ports"("circuit_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "circuit_hoses" ADD CONSTRAINT "circuit_hoses_circuit_id_to_port_id_circuit_ports_circuit_id_id_fk" FOREIGN KEY ("circuit_id","to_port_id") REFERENCES "public"."circuit_ports"("circuit_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "circuit_ports" ADD CONSTRAINT "circuit_ports_circuit_id_circuits_id_fk" FOREIGN KEY ("circuit_id") REFERENCES "public"."circuits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "circuit_ports" ADD CONSTRAINT "circuit_ports_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "circuit_ports" ADD CONSTRAINT "circuit_ports_circuit_id_component_id_circuit_components_circuit_id_id_fk" FOREIGN KEY ("circuit_id","component_id") REFERENCES "public"."circuit_components"("circuit_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "circuit_revisions" ADD CONSTRAINT "circuit_revisions_circuit_id_circuits_id_fk" FOREIGN KEY ("circuit_id") REFERENCES "public"."circuits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "circuit_revisions" ADD CONSTRAINT "circuit_revisions_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "circuit_revisions" ADD CONSTRAINT "circuit_revisions_saved_by_users_id_fk" FOREIGN KEY ("saved_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "circuit_components_workshop" ON "circuit_components" USING btree ("workshop_id");