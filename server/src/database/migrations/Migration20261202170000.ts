import { Migration } from '@mikro-orm/migrations';

/**
 * Replayed forecast runs: each run says whether the desk issued it or it was replayed at the
 * installation's first start (src/replay), and a schedule revision whether its model values came
 * from a replayed run. Existing rows are what the desk issued.
 */
export class Migration20261202170000 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table \`forecast_runs\` add \`origin\` enum('issued', 'replayed') not null default 'issued';`);
    this.addSql(`alter table \`schedule_revisions\` add \`forecast_replayed\` tinyint(1) not null default false;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`schedule_revisions\` drop column \`forecast_replayed\`;`);
    this.addSql(`alter table \`forecast_runs\` drop column \`origin\`;`);
  }

}
