import { Migration } from '@mikro-orm/migrations';

/**
 * Worked-out models are kept as json, not jsonb: jsonb sorts object keys, and the model document downloaded
 * from a stored row should read as it was written (format and version first). Written by hand: the schema
 * diff does not tell json from jsonb.
 */
export class Migration20261202022954_model_details_as_written extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "sweep_model" alter column "details" type json using "details"::json;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "sweep_model" alter column "details" type jsonb using "details"::jsonb;`);
  }

}
