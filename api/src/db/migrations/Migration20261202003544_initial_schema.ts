import { Migration } from '@mikro-orm/migrations';

export class Migration20261202003544_initial_schema extends Migration {

  override async up(): Promise<void> {
    // Sessions belong to connect-pg-simple (its table.sql); the schema diff skips this table.
    this.addSql(`create table "session" ("sid" varchar not null collate "default", "sess" json not null, "expire" timestamp(6) not null, constraint "session_pkey" primary key ("sid"));`);
    this.addSql(`create index "IDX_session_expire" on "session" ("expire");`);

    this.addSql(`create table "audit_event" ("id" uuid not null, "action" varchar(60) not null, "actor_id" uuid null, "actor_email" varchar(254) null, "team_id" uuid null, "target_type" varchar(40) null, "target_id" uuid null, "details" jsonb not null, "client_address" varchar(64) null, "created_at" timestamptz not null, constraint "audit_event_pkey" primary key ("id"));`);
    this.addSql(`create index "audit_event_action_index" on "audit_event" ("action");`);
    this.addSql(`create index "audit_event_team_id_index" on "audit_event" ("team_id");`);
    this.addSql(`create index "audit_event_created_at_index" on "audit_event" ("created_at");`);

    this.addSql(`create table "team" ("id" uuid not null, "name" varchar(120) not null, "created_at" timestamptz not null, constraint "team_pkey" primary key ("id"));`);
    this.addSql(`alter table "team" add constraint "team_name_unique" unique ("name");`);

    this.addSql(`create table "project" ("id" uuid not null, "team_id" uuid not null, "name" varchar(120) not null, "description" text not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "project_pkey" primary key ("id"));`);
    this.addSql(`alter table "project" add constraint "project_team_id_name_unique" unique ("team_id", "name");`);

    this.addSql(`create table "app_user" ("id" uuid not null, "email" varchar(254) not null, "name" varchar(120) not null, "password_hash" varchar(255) not null, "role" text check ("role" in ('admin', 'analyst', 'viewer')) not null, "team_id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "app_user_pkey" primary key ("id"));`);
    this.addSql(`alter table "app_user" add constraint "app_user_email_unique" unique ("email");`);

    this.addSql(`alter table "project" add constraint "project_team_id_foreign" foreign key ("team_id") references "team" ("id") on update cascade;`);

    this.addSql(`alter table "app_user" add constraint "app_user_team_id_foreign" foreign key ("team_id") references "team" ("id") on update cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "project" drop constraint "project_team_id_foreign";`);

    this.addSql(`alter table "app_user" drop constraint "app_user_team_id_foreign";`);

    this.addSql(`drop table if exists "audit_event" cascade;`);

    this.addSql(`drop table if exists "team" cascade;`);

    this.addSql(`drop table if exists "project" cascade;`);

    this.addSql(`drop table if exists "app_user" cascade;`);

    this.addSql(`drop table if exists "session";`);
  }

}
