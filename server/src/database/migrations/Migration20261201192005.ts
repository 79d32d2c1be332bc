import { Migration } from '@mikro-orm/migrations';

/** Users, zones and the audit trail; the trail refuses UPDATE and DELETE at the database. */
export class Migration20261201192005 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`audit_entries\` (\`id\` bigint unsigned not null auto_increment primary key, \`at\` datetime(3) not null, \`actor_id\` int null, \`actor_email\` varchar(254) null, \`action\` varchar(64) not null, \`subject_type\` varchar(64) not null, \`subject_id\` varchar(64) null, \`before\` json null, \`after\` json null, \`reason\` text null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`audit_entries\` add index \`audit_entries_at_index\`(\`at\`);`);
    this.addSql(`alter table \`audit_entries\` add index \`audit_entries_action_index\`(\`action\`);`);
    this.addSql(`alter table \`audit_entries\` add index \`audit_entries_subject_type_subject_id_index\`(\`subject_type\`, \`subject_id\`);`);

    this.addSql(`create table \`users\` (\`id\` int unsigned not null auto_increment primary key, \`email\` varchar(254) not null, \`name\` varchar(120) not null, \`role\` enum('viewer', 'operator', 'supervisor', 'admin') not null, \`password_hash\` varchar(255) not null, \`active\` tinyint(1) not null default true, \`created_at\` datetime(3) not null, \`last_login_at\` datetime(3) null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`users\` add unique \`users_email_unique\`(\`email\`);`);

    this.addSql(`create table \`zones\` (\`id\` int unsigned not null auto_increment primary key, \`code\` varchar(32) not null, \`name\` varchar(120) not null, \`time_zone\` varchar(64) not null, \`alert_threshold_pct\` double not null default 5, \`alert_consecutive_hours\` int not null default 2, \`gate_closure\` varchar(5) not null default '10:00', \`min_plausible_mw\` double not null default 0, \`max_plausible_mw\` double not null default 1000, \`active\` tinyint(1) not null default true, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`zones\` add unique \`zones_code_unique\`(\`code\`);`);

    // Append-only: the trail is evidence, so even the application's own account cannot rewrite it.
    this.addSql(`create trigger \`audit_entries_no_update\` before update on \`audit_entries\` for each row signal sqlstate '45000' set message_text = 'The audit trail is append-only';`);
    this.addSql(`create trigger \`audit_entries_no_delete\` before delete on \`audit_entries\` for each row signal sqlstate '45000' set message_text = 'The audit trail is append-only';`);
  }

  override async down(): Promise<void> {
    this.addSql('drop table if exists `audit_entries`;');
    this.addSql('drop table if exists `users`;');
    this.addSql('drop table if exists `zones`;');
  }

}
