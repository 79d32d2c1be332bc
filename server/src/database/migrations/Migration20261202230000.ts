import { Migration } from '@mikro-orm/migrations';

/**
 * Deviation alerts say what they were measured against (the published schedule or the day-ahead
 * forecast) and its MW at the peak hour, and keep the name of who acknowledged them for the alert
 * history. Alerts raised before leave these empty.
 */
export class Migration20261202230000 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table \`deviation_alerts\` add \`compared_with\` varchar(16) null, add \`committed_mw\` double null, add \`acknowledged_by_name\` varchar(120) null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`deviation_alerts\` drop column \`compared_with\`, drop column \`committed_mw\`, drop column \`acknowledged_by_name\`;`);
  }

}
