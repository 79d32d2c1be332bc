import { Migration } from '@mikro-orm/migrations';

/**
 * Live load: stored hourly readings keyed by (zone, UTC hour start) with the revisions they
 * replaced, meter-feed API keys (hashed) and deviation alerts.
 */
export class Migration20261201192644 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`reading_revisions\` (\`id\` bigint unsigned not null auto_increment primary key, \`zone_id\` int unsigned not null, \`hour_start\` datetime not null, \`mw\` double not null, \`quality\` enum('good', 'estimated', 'suspect') not null, \`source\` varchar(160) not null, \`received_at\` datetime(3) not null, \`replaced_at\` datetime(3) not null, \`replaced_by\` varchar(160) not null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`reading_revisions\` add index \`reading_revisions_zone_id_hour_start_index\`(\`zone_id\`, \`hour_start\`);`);

    this.addSql(`create table \`readings\` (\`zone_id\` int unsigned not null, \`hour_start\` datetime not null, \`mw\` double not null, \`quality\` enum('good', 'estimated', 'suspect') not null default 'good', \`source\` varchar(160) not null, \`received_at\` datetime(3) not null, primary key (\`zone_id\`, \`hour_start\`)) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`readings\` add index \`readings_zone_id_index\`(\`zone_id\`);`);

    this.addSql(`create table \`feed_keys\` (\`id\` int unsigned not null auto_increment primary key, \`name\` varchar(120) not null, \`key_hash\` varchar(64) not null, \`prefix\` varchar(16) not null, \`zone_id\` int unsigned null, \`created_at\` datetime(3) not null, \`created_by_id\` int null, \`created_by_email\` varchar(254) null, \`last_used_at\` datetime(3) null, \`revoked_at\` datetime(3) null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`feed_keys\` add unique \`feed_keys_name_unique\`(\`name\`);`);
    this.addSql(`alter table \`feed_keys\` add unique \`feed_keys_key_hash_unique\`(\`key_hash\`);`);
    this.addSql(`alter table \`feed_keys\` add index \`feed_keys_zone_id_index\`(\`zone_id\`);`);

    this.addSql(`create table \`deviation_alerts\` (\`id\` int unsigned not null auto_increment primary key, \`zone_id\` int unsigned not null, \`start\` datetime not null, \`end\` datetime not null, \`peak_deviation_pct\` double not null, \`threshold_pct\` double not null, \`consecutive_hours\` int not null, \`state\` enum('open', 'acknowledged') not null default 'open', \`raised_at\` datetime(3) not null, \`acknowledged_at\` datetime(3) null, \`acknowledged_by_id\` int null, \`acknowledged_by_email\` varchar(254) null, \`comment\` text null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`deviation_alerts\` add index \`deviation_alerts_zone_id_index\`(\`zone_id\`);`);
    this.addSql(`alter table \`deviation_alerts\` add index \`deviation_alerts_state_index\`(\`state\`);`);
    this.addSql(`alter table \`deviation_alerts\` add index \`deviation_alerts_zone_id_start_index\`(\`zone_id\`, \`start\`);`);

    this.addSql(`alter table \`readings\` add constraint \`readings_zone_id_foreign\` foreign key (\`zone_id\`) references \`zones\` (\`id\`) on update cascade on delete restrict;`);

    this.addSql(`alter table \`feed_keys\` add constraint \`feed_keys_zone_id_foreign\` foreign key (\`zone_id\`) references \`zones\` (\`id\`) on update cascade on delete restrict;`);

    this.addSql(`alter table \`deviation_alerts\` add constraint \`deviation_alerts_zone_id_foreign\` foreign key (\`zone_id\`) references \`zones\` (\`id\`) on update cascade on delete restrict;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists \`reading_revisions\`;`);

    this.addSql(`drop table if exists \`readings\`;`);

    this.addSql(`drop table if exists \`feed_keys\`;`);

    this.addSql(`drop table if exists \`deviation_alerts\`;`);
  }

}
