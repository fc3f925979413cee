import { Migration } from '@mikro-orm/migrations';

export class Migration20261202022157_model_details extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "sweep_model" ("id" uuid not null, "sweep_id" uuid not null, "model_index" int not null, "details" jsonb not null, "created_at" timestamptz not null, constraint "sweep_model_pkey" primary key ("id"));`);
    this.addSql(`alter table "sweep_model" add constraint "sweep_model_sweep_id_model_index_unique" unique ("sweep_id", "model_index");`);

    this.addSql(`alter table "sweep_model" add constraint "sweep_model_sweep_id_foreign" foreign key ("sweep_id") references "sweep" ("id") on update cascade on delete cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "sweep_model" cascade;`);
  }

}
