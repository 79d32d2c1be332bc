import { Migration } from '@mikro-orm/migrations';

/** The shift log: handover notes and their structured items. */
export class Migration20261201200000 extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table \`handover_notes\` (\`id\` int unsigned not null auto_increment primary key, \`shift_start\` datetime(3) not null, \`shift_end\` datetime(3) not null, \`shift_label\` varchar(80) not null, \`author_id\` int unsigned not null, \`body\` text not null, \`created_at\` datetime(3) not null, \`acknowledged_by_id\` int unsigned null, \`acknowledged_at\` datetime(3) null, \`reply\` text null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`handover_notes\` add index \`handover_notes_shift_start_index\`(\`shift_start\`);`);
    this.addSql(`alter table \`handover_notes\` add index \`handover_notes_created_at_index\`(\`created_at\`);`);
    this.addSql(`alter table \`handover_notes\` add index \`handover_notes_author_id_index\`(\`author_id\`);`);
    this.addSql(`alter table \`handover_notes\` add index \`handover_notes_acknowledged_by_id_index\`(\`acknowledged_by_id\`);`);
    this.addSql(`alter table \`handover_notes\` add constraint \`handover_notes_author_id_foreign\` foreign key (\`author_id\`) references \`users\` (\`id\`) on update cascade;`);
    this.addSql(`alter table \`handover_notes\` add constraint \`handover_notes_acknowledged_by_id_foreign\` foreign key (\`acknowledged_by_id\`) references \`users\` (\`id\`) on update cascade on delete set null;`);

    this.addSql(`create table \`handover_items\` (\`id\` int unsigned not null auto_increment primary key, \`note_id\` int unsigned not null, \`kind\` enum('open-issue', 'outage-in-progress', 'refit-pending', 'schedule-not-published', 'other') not null, \`zone_code\` varchar(32) null, \`text\` text not null, \`status\` enum('open', 'closed') not null, \`carried_from_item_id\` int null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`handover_items\` add index \`handover_items_note_id_index\`(\`note_id\`);`);
    this.addSql(`alter table \`handover_items\` add constraint \`handover_items_note_id_foreign\` foreign key (\`note_id\`) references \`handover_notes\` (\`id\`) on update cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql('drop table if exists `handover_items`;');
    this.addSql('drop table if exists `handover_notes`;');
  }
}
