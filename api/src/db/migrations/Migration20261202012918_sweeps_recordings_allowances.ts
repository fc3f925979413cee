import { Migration } from '@mikro-orm/migrations';

export class Migration20261202012918_sweeps_recordings_allowances extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "mail_message" ("id" uuid not null, "received_at" timestamptz not null, "sender" varchar(320) not null, "recipients" jsonb not null, "subject" text not null, "text" text not null, "html" text null, constraint "mail_message_pkey" primary key ("id"));`);
    this.addSql(`create index "mail_message_received_at_index" on "mail_message" ("received_at");`);

    this.addSql(`create table "subset_throughput" ("size" int not null, "subsets" double precision not null, "cpu_seconds" double precision not null, "updated_at" timestamptz not null, constraint "subset_throughput_pkey" primary key ("size"));`);

    this.addSql(`create table "sweep" ("id" uuid not null, "project_id" uuid not null, "team_id" uuid not null, "name" varchar(120) not null, "state" text check ("state" in ('queued', 'running', 'finished', 'cancelled', 'failed', 'halted')) not null, "state_reason" text null, "candidate_set_id" uuid null, "candidate_set_name" varchar(120) not null, "description" jsonb not null, "launched_by_id" uuid not null, "launched_by_name" varchar(120) not null, "launched_by_email" varchar(254) not null, "launched_at" timestamptz not null, "started_at" timestamptz null, "ended_at" timestamptz null, "cancelled_by_id" uuid null, "cancelled_by_name" varchar(120) null, "cancelled_at" timestamptz null, "total_subsets" double precision not null, "estimated_cpu_seconds" double precision not null, "evaluated" double precision not null default 0, "rejected" double precision not null default 0, "cpu_seconds" double precision not null default 0, "shard_count" int not null default 0, "shards_done" int not null default 0, "candidate_count" int null, "row_count" int null, "excluded" jsonb not null, "warnings" jsonb not null, "problem_meta" jsonb null, "problem_data" bytea null, "leaderboard" jsonb null, "leaderboard_version" int not null default 0, "result" jsonb null, "notified_at" timestamptz null, constraint "sweep_pkey" primary key ("id"));`);
    this.addSql(`create index "sweep_state_index" on "sweep" ("state");`);
    this.addSql(`create index "sweep_launched_at_index" on "sweep" ("launched_at");`);

    this.addSql(`create table "shard" ("id" uuid not null, "sweep_id" uuid not null, "index" int not null, "slices" jsonb not null, "subsets" double precision not null, "state" text check ("state" in ('queued', 'running', 'done', 'cancelled', 'failed')) not null, "attempts" int not null default 0, "worker" varchar(200) null, "evaluated" double precision not null default 0, "rejected" double precision not null default 0, "cpu_seconds" double precision not null default 0, "started_at" timestamptz null, "ended_at" timestamptz null, constraint "shard_pkey" primary key ("id"));`);
    this.addSql(`alter table "shard" add constraint "shard_sweep_id_index_unique" unique ("sweep_id", "index");`);

    this.addSql(`create table "recording" ("id" uuid not null, "project_id" uuid not null, "name" varchar(120) not null, "file_name" varchar(255) not null, "size_bytes" int not null, "coordinates" jsonb not null, "mapping" jsonb not null, "channels" jsonb not null, "sample_count" int not null, "start_time" double precision not null, "duration_seconds" double precision not null, "sampling" jsonb not null, "forced" boolean not null, "uploaded_by_id" uuid null, "uploaded_by_name" varchar(120) null, "created_at" timestamptz not null, constraint "recording_pkey" primary key ("id"));`);

    this.addSql(`create table "recording_samples" ("recording_id" uuid not null, "data" bytea not null, constraint "recording_samples_pkey" primary key ("recording_id"));`);

    this.addSql(`create table "candidate_set" ("id" uuid not null, "project_id" uuid not null, "name" varchar(120) not null, "coordinates" jsonb not null, "terms" jsonb not null, "known" jsonb not null, "reference" jsonb null, "generator" jsonb null, "candidate_count" int not null, "created_by_id" uuid null, "created_by_name" varchar(120) null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "candidate_set_pkey" primary key ("id"));`);
    this.addSql(`alter table "candidate_set" add constraint "candidate_set_project_id_name_unique" unique ("project_id", "name");`);

    this.addSql(`create table "team_allowance" ("team_id" uuid not null, "cpu_seconds_per_month" double precision not null, "sweeps_at_once" int not null, "subsets_per_sweep" double precision not null, "updated_at" timestamptz not null, constraint "team_allowance_pkey" primary key ("team_id"));`);

    this.addSql(`create table "usage_charge" ("id" uuid not null, "team_id" uuid not null, "sweep_id" uuid not null, "shard_id" uuid not null, "cpu_seconds" double precision not null, "subsets" double precision not null, "charged_at" timestamptz not null, constraint "usage_charge_pkey" primary key ("id"));`);
    this.addSql(`create index "usage_charge_sweep_id_index" on "usage_charge" ("sweep_id");`);
    this.addSql(`alter table "usage_charge" add constraint "usage_charge_shard_id_unique" unique ("shard_id");`);
    this.addSql(`create index "usage_charge_team_id_charged_at_index" on "usage_charge" ("team_id", "charged_at");`);

    this.addSql(`create table "worker_presence" ("id" varchar(200) not null, "host" varchar(200) not null, "pid" int not null, "threads" int not null, "started_at" timestamptz not null, "last_seen_at" timestamptz not null, constraint "worker_presence_pkey" primary key ("id"));`);
    this.addSql(`create index "worker_presence_last_seen_at_index" on "worker_presence" ("last_seen_at");`);

    this.addSql(`alter table "sweep" add constraint "sweep_project_id_foreign" foreign key ("project_id") references "project" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "sweep" add constraint "sweep_team_id_foreign" foreign key ("team_id") references "team" ("id") on update cascade;`);

    this.addSql(`alter table "shard" add constraint "shard_sweep_id_foreign" foreign key ("sweep_id") references "sweep" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "recording" add constraint "recording_project_id_foreign" foreign key ("project_id") references "project" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "recording_samples" add constraint "recording_samples_recording_id_foreign" foreign key ("recording_id") references "recording" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "candidate_set" add constraint "candidate_set_project_id_foreign" foreign key ("project_id") references "project" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "team_allowance" add constraint "team_allowance_team_id_foreign" foreign key ("team_id") references "team" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "usage_charge" add constraint "usage_charge_team_id_foreign" foreign key ("team_id") references "team" ("id") on update cascade on delete cascade;`);

  }

  override async down(): Promise<void> {
    this.addSql(`alter table "shard" drop constraint "shard_sweep_id_foreign";`);

    this.addSql(`alter table "recording_samples" drop constraint "recording_samples_recording_id_foreign";`);


    this.addSql(`drop table if exists "mail_message" cascade;`);

    this.addSql(`drop table if exists "subset_throughput" cascade;`);

    this.addSql(`drop table if exists "sweep" cascade;`);

    this.addSql(`drop table if exists "shard" cascade;`);

    this.addSql(`drop table if exists "recording" cascade;`);

    this.addSql(`drop table if exists "recording_samples" cascade;`);

    this.addSql(`drop table if exists "candidate_set" cascade;`);

    this.addSql(`drop table if exists "team_allowance" cascade;`);

    this.addSql(`drop table if exists "usage_charge" cascade;`);

    this.addSql(`drop table if exists "worker_presence" cascade;`);
  }

}
