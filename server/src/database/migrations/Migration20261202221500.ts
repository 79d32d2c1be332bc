import { Migration } from '@mikro-orm/migrations';

/**
 * Ordered ingest: each stored reading and each revision carries the version (microseconds since
 * the epoch) that orders values of one (zone, hour); the store applies a value only over a lower
 * version. Rows stored before have version 0, so any versioned value replaces them. A revision is
 * unique per (zone, hour, version) so a resent superseded value is kept once; earlier revisions
 * have no version (NULL, which the unique key lets repeat).
 */
export class Migration20261202221500 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table \`readings\` add \`version\` bigint unsigned not null default 0;`);
    this.addSql(`alter table \`reading_revisions\` add \`version\` bigint unsigned null default null;`);
    this.addSql(`alter table \`reading_revisions\` add unique \`reading_revisions_zone_id_hour_start_version_unique\`(\`zone_id\`, \`hour_start\`, \`version\`);`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`reading_revisions\` drop index \`reading_revisions_zone_id_hour_start_version_unique\`;`);
    this.addSql(`alter table \`reading_revisions\` drop column \`version\`;`);
    this.addSql(`alter table \`readings\` drop column \`version\`;`);
  }

}
