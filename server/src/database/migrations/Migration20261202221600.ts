import { Migration } from '@mikro-orm/migrations';

/**
 * Sessions that end: every access token carries the user's session version at sign-in, and a
 * sign-out raises the version, so every token issued before it is refused from then on.
 */
export class Migration20261202221600 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table \`users\` add \`session_version\` int unsigned not null default 0;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`users\` drop column \`session_version\`;`);
  }

}
