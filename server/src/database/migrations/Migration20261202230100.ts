import { Migration } from '@mikro-orm/migrations';

/**
 * Forecast vintages: an adjustment a correction carried forward from an earlier revision keeps
 * the number of the revision it was first made on.
 */
export class Migration20261202230100 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table \`schedule_adjustments\` add \`carried_from_revision\` int null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`schedule_adjustments\` drop column \`carried_from_revision\`;`);
  }

}
