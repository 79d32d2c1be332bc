import { Migration } from '@mikro-orm/migrations';

/** Day-ahead schedules: revisions (hours as JSON), their adjustments, and the e-mail subscribers. */
export class Migration20261201203510 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`schedule_subscribers\` (\`id\` int unsigned not null auto_increment primary key, \`email\` varchar(254) not null, \`name\` varchar(120) not null, \`zones\` json null, \`active\` tinyint(1) not null default true, \`added_by_id\` int unsigned null, \`added_at\` datetime(3) not null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`schedule_subscribers\` add unique \`schedule_subscribers_email_unique\`(\`email\`);`);
    this.addSql(`alter table \`schedule_subscribers\` add index \`schedule_subscribers_added_by_id_index\`(\`added_by_id\`);`);

    this.addSql(`create table \`schedule_revisions\` (\`id\` int unsigned not null auto_increment primary key, \`zone_id\` int unsigned not null, \`operating_day\` varchar(10) not null, \`revision\` int not null, \`state\` enum('draft', 'submitted', 'returned', 'published', 'superseded') not null, \`working_key\` varchar(48) null, \`published_key\` varchar(48) null, \`forecast_run_id\` int null, \`forecast_issued_at\` datetime(3) null, \`hours\` json not null, \`created_by_id\` int unsigned not null, \`created_at\` datetime(3) not null, \`submitted_by_id\` int unsigned null, \`submitted_at\` datetime(3) null, \`submit_comment\` text null, \`late\` tinyint(1) not null default false, \`returned_by_id\` int unsigned null, \`returned_at\` datetime(3) null, \`return_comment\` text null, \`published_by_id\` int unsigned null, \`published_at\` datetime(3) null, \`superseded_at\` datetime(3) null, \`correction_reason\` text null, \`mail_outcome\` json null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`schedule_revisions\` add index \`schedule_revisions_zone_id_index\`(\`zone_id\`);`);
    this.addSql(`alter table \`schedule_revisions\` add unique \`schedule_revisions_working_key_unique\`(\`working_key\`);`);
    this.addSql(`alter table \`schedule_revisions\` add unique \`schedule_revisions_published_key_unique\`(\`published_key\`);`);
    this.addSql(`alter table \`schedule_revisions\` add index \`schedule_revisions_created_by_id_index\`(\`created_by_id\`);`);
    this.addSql(`alter table \`schedule_revisions\` add index \`schedule_revisions_submitted_by_id_index\`(\`submitted_by_id\`);`);
    this.addSql(`alter table \`schedule_revisions\` add index \`schedule_revisions_returned_by_id_index\`(\`returned_by_id\`);`);
    this.addSql(`alter table \`schedule_revisions\` add index \`schedule_revisions_published_by_id_index\`(\`published_by_id\`);`);
    this.addSql(`alter table \`schedule_revisions\` add index \`schedule_revisions_operating_day_index\`(\`operating_day\`);`);
    this.addSql(`alter table \`schedule_revisions\` add unique \`schedule_revisions_zone_id_operating_day_revision_unique\`(\`zone_id\`, \`operating_day\`, \`revision\`);`);

    this.addSql(`create table \`schedule_adjustments\` (\`id\` int unsigned not null auto_increment primary key, \`revision_id\` int unsigned not null, \`zone_code\` varchar(32) not null, \`kind\` enum('set', 'add', 'scale') not null, \`from_hour\` int not null, \`to_hour\` int not null, \`value\` double not null, \`reason\` text not null, \`by_id\` int unsigned not null, \`at\` datetime(3) not null, \`undone_at\` datetime(3) null, \`undone_by_id\` int unsigned null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`schedule_adjustments\` add index \`schedule_adjustments_revision_id_index\`(\`revision_id\`);`);
    this.addSql(`alter table \`schedule_adjustments\` add index \`schedule_adjustments_by_id_index\`(\`by_id\`);`);
    this.addSql(`alter table \`schedule_adjustments\` add index \`schedule_adjustments_undone_by_id_index\`(\`undone_by_id\`);`);

    this.addSql(`alter table \`schedule_subscribers\` add constraint \`schedule_subscribers_added_by_id_foreign\` foreign key (\`added_by_id\`) references \`users\` (\`id\`) on update cascade on delete set null;`);

    this.addSql(`alter table \`schedule_revisions\` add constraint \`schedule_revisions_zone_id_foreign\` foreign key (\`zone_id\`) references \`zones\` (\`id\`) on update cascade on delete restrict;`);
    this.addSql(`alter table \`schedule_revisions\` add constraint \`schedule_revisions_created_by_id_foreign\` foreign key (\`created_by_id\`) references \`users\` (\`id\`) on update cascade;`);
    this.addSql(`alter table \`schedule_revisions\` add constraint \`schedule_revisions_submitted_by_id_foreign\` foreign key (\`submitted_by_id\`) references \`users\` (\`id\`) on update cascade on delete set null;`);
    this.addSql(`alter table \`schedule_revisions\` add constraint \`schedule_revisions_returned_by_id_foreign\` foreign key (\`returned_by_id\`) references \`users\` (\`id\`) on update cascade on delete set null;`);
    this.addSql(`alter table \`schedule_revisions\` add constraint \`schedule_revisions_published_by_id_foreign\` foreign key (\`published_by_id\`) references \`users\` (\`id\`) on update cascade on delete set null;`);

    this.addSql(`alter table \`schedule_adjustments\` add constraint \`schedule_adjustments_revision_id_foreign\` foreign key (\`revision_id\`) references \`schedule_revisions\` (\`id\`) on update cascade on delete restrict;`);
    this.addSql(`alter table \`schedule_adjustments\` add constraint \`schedule_adjustments_by_id_foreign\` foreign key (\`by_id\`) references \`users\` (\`id\`) on update cascade;`);
    this.addSql(`alter table \`schedule_adjustments\` add constraint \`schedule_adjustments_undone_by_id_foreign\` foreign key (\`undone_by_id\`) references \`users\` (\`id\`) on update cascade on delete set null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`schedule_adjustments\` drop foreign key \`schedule_adjustments_revision_id_foreign\`;`);

    this.addSql(`drop table if exists \`schedule_subscribers\`;`);

    this.addSql(`drop table if exists \`schedule_revisions\`;`);

    this.addSql(`drop table if exists \`schedule_adjustments\`;`);
  }

}
