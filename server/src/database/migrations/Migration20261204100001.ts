import { Migration } from '@mikro-orm/migrations';

/**
 * Adjustments added together (a weather what-if turned into one "add" per hour) share a batch:
 * the id of the first of them. The batch is undone together, as it was added; single adjustments
 * and those carried forward by a correction have none.
 */
export class Migration20261204100001 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table \`schedule_adjustments\` add \`batch_id\` int unsigned null;`);
    this.addSql(`alter table \`schedule_adjustments\` add index \`schedule_adjustments_batch_id_index\`(\`batch_id\`);`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`schedule_adjustments\` drop index \`schedule_adjustments_batch_id_index\`;`);
    this.addSql(`alter table \`schedule_adjustments\` drop column \`batch_id\`;`);
  }

}
