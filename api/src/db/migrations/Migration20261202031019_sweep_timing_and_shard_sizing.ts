import { Migration } from '@mikro-orm/migrations';

export class Migration20261202031019_sweep_timing_and_shard_sizing extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "sweep_timing" ("sweep_id" uuid not null, "finished_at" timestamptz not null, "prepare_seconds" double precision not null, "finish_seconds" double precision not null, "shard_count" int not null, "threads" int not null, "shard_cpu_seconds" double precision not null, "shard_phase_seconds" double precision not null, "shard_overhead_seconds" double precision not null, constraint "sweep_timing_pkey" primary key ("sweep_id"));`);
    this.addSql(`create index "sweep_timing_finished_at_index" on "sweep_timing" ("finished_at");`);

    this.addSql(`alter table "subset_throughput" add column "shards" double precision not null default 0;`);

    this.addSql(`alter table "worker_presence" add column "shard_seconds" double precision not null default 30, add column "shard_subsets" double precision null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "sweep_timing" cascade;`);

    this.addSql(`alter table "subset_throughput" drop column "shards";`);

    this.addSql(`alter table "worker_presence" drop column "shard_seconds", drop column "shard_subsets";`);
  }

}
