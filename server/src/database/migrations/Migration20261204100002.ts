import { Migration } from '@mikro-orm/migrations';

/**
 * A zone's first model, fitted a little after start-up or once the zone has a week of history,
 * gets a trigger of its own ("first-model") instead of the nightly refit's: the Refits screen
 * called it nightly. Rows stored before are recognised by their job's reason.
 */
export class Migration20261204100002 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table \`refit_jobs\` modify \`trigger\` enum('schedule', 'operator', 'update', 'first-model') not null;`);
    this.addSql(`alter table \`model_versions\` modify \`trigger\` enum('schedule', 'operator', 'update', 'first-model') not null;`);
    this.addSql(`update \`refit_jobs\` set \`trigger\` = 'first-model' where \`trigger\` = 'schedule' and \`reason\` = 'first model of the zone';`);
    this.addSql(`update \`model_versions\` v join \`refit_jobs\` j on j.\`id\` = v.\`job_id\` set v.\`trigger\` = 'first-model' where j.\`trigger\` = 'first-model';`);
  }

  override async down(): Promise<void> {
    this.addSql(`update \`model_versions\` set \`trigger\` = 'schedule' where \`trigger\` = 'first-model';`);
    this.addSql(`update \`refit_jobs\` set \`trigger\` = 'schedule' where \`trigger\` = 'first-model';`);
    this.addSql(`alter table \`model_versions\` modify \`trigger\` enum('schedule', 'operator', 'update') not null;`);
    this.addSql(`alter table \`refit_jobs\` modify \`trigger\` enum('schedule', 'operator', 'update') not null;`);
  }

}
