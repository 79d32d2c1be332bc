import { Migration } from '@mikro-orm/migrations';

/**
 * Weather and the calendar: weather stations and each zone's weights over them; observed hourly
 * temperature per station (one row per hour, ordered by version as readings are); temperature
 * forecast vintages, insert only (an UPDATE is refused by trigger, so a vintage is never
 * overwritten); the holiday and special-day calendar with the zones each day applies to; feed keys
 * scoped to one station.
 */
export class Migration20261203050000 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`special_days\` (\`id\` int unsigned not null auto_increment primary key, \`day\` date not null, \`name\` varchar(120) not null, \`kind\` enum('public-holiday', 'bridge-day', 'local-event') not null, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`special_days\` add unique \`special_days_day_name_unique\`(\`day\`, \`name\`);`);

    this.addSql(`create table \`weather_stations\` (\`id\` int unsigned not null auto_increment primary key, \`code\` varchar(32) not null, \`name\` varchar(120) not null, \`time_zone\` varchar(64) not null, \`latitude\` double null, \`longitude\` double null, \`elevation_m\` double null, \`created_at\` datetime(3) not null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`weather_stations\` add unique \`weather_stations_code_unique\`(\`code\`);`);

    this.addSql(`create table \`temperature_observations\` (\`station_id\` int unsigned not null, \`hour_start\` datetime not null, \`temp_c\` double not null, \`source\` varchar(160) not null, \`received_at\` datetime(3) not null, \`version\` bigint unsigned not null default 0, primary key (\`station_id\`, \`hour_start\`)) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`temperature_observations\` add index \`temperature_observations_station_id_index\`(\`station_id\`);`);

    this.addSql(`create table \`temperature_forecasts\` (\`id\` bigint unsigned not null auto_increment primary key, \`station_id\` int unsigned not null, \`issued_at\` datetime(3) not null, \`hour_start\` datetime not null, \`member\` varchar(16) not null default '', \`temp_c\` double not null, \`source\` varchar(160) not null, \`received_at\` datetime(3) not null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`temperature_forecasts\` add index \`temperature_forecasts_station_id_index\`(\`station_id\`);`);
    this.addSql(`alter table \`temperature_forecasts\` add index \`temperature_forecasts_hour_index\`(\`station_id\`, \`hour_start\`, \`issued_at\`);`);
    this.addSql(`alter table \`temperature_forecasts\` add unique \`temperature_forecasts_vintage_unique\`(\`station_id\`, \`issued_at\`, \`hour_start\`, \`member\`);`);
    this.addSql(`create trigger \`temperature_forecasts_no_update\` before update on \`temperature_forecasts\` for each row signal sqlstate '45000' set message_text = 'Temperature forecast vintages are never overwritten';`);

    this.addSql(`create table \`special_day_zones\` (\`special_day_id\` int unsigned not null, \`zone_id\` int unsigned not null, primary key (\`special_day_id\`, \`zone_id\`)) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`special_day_zones\` add index \`special_day_zones_special_day_id_index\`(\`special_day_id\`);`);
    this.addSql(`alter table \`special_day_zones\` add index \`special_day_zones_zone_id_index\`(\`zone_id\`);`);

    this.addSql(`create table \`zone_station_weights\` (\`zone_id\` int unsigned not null, \`station_id\` int unsigned not null, \`weight\` double not null, primary key (\`zone_id\`, \`station_id\`)) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`zone_station_weights\` add index \`zone_station_weights_zone_id_index\`(\`zone_id\`);`);
    this.addSql(`alter table \`zone_station_weights\` add index \`zone_station_weights_station_id_index\`(\`station_id\`);`);

    this.addSql(`alter table \`temperature_observations\` add constraint \`temperature_observations_station_id_foreign\` foreign key (\`station_id\`) references \`weather_stations\` (\`id\`) on update cascade on delete restrict;`);

    this.addSql(`alter table \`temperature_forecasts\` add constraint \`temperature_forecasts_station_id_foreign\` foreign key (\`station_id\`) references \`weather_stations\` (\`id\`) on update cascade on delete restrict;`);

    this.addSql(`alter table \`special_day_zones\` add constraint \`special_day_zones_special_day_id_foreign\` foreign key (\`special_day_id\`) references \`special_days\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`special_day_zones\` add constraint \`special_day_zones_zone_id_foreign\` foreign key (\`zone_id\`) references \`zones\` (\`id\`) on update cascade on delete cascade;`);

    this.addSql(`alter table \`zone_station_weights\` add constraint \`zone_station_weights_zone_id_foreign\` foreign key (\`zone_id\`) references \`zones\` (\`id\`) on update cascade on delete cascade;`);
    this.addSql(`alter table \`zone_station_weights\` add constraint \`zone_station_weights_station_id_foreign\` foreign key (\`station_id\`) references \`weather_stations\` (\`id\`) on update cascade on delete restrict;`);

    this.addSql(`alter table \`feed_keys\` add \`station_id\` int unsigned null;`);
    this.addSql(`alter table \`feed_keys\` add constraint \`feed_keys_station_id_foreign\` foreign key (\`station_id\`) references \`weather_stations\` (\`id\`) on update cascade on delete restrict;`);
    this.addSql(`alter table \`feed_keys\` add index \`feed_keys_station_id_index\`(\`station_id\`);`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop trigger if exists \`temperature_forecasts_no_update\`;`);
    this.addSql(`alter table \`special_day_zones\` drop foreign key \`special_day_zones_special_day_id_foreign\`;`);

    this.addSql(`alter table \`temperature_observations\` drop foreign key \`temperature_observations_station_id_foreign\`;`);

    this.addSql(`alter table \`temperature_forecasts\` drop foreign key \`temperature_forecasts_station_id_foreign\`;`);

    this.addSql(`alter table \`feed_keys\` drop foreign key \`feed_keys_station_id_foreign\`;`);

    this.addSql(`alter table \`zone_station_weights\` drop foreign key \`zone_station_weights_station_id_foreign\`;`);

    this.addSql(`drop table if exists \`special_days\`;`);

    this.addSql(`drop table if exists \`weather_stations\`;`);

    this.addSql(`drop table if exists \`temperature_observations\`;`);

    this.addSql(`drop table if exists \`temperature_forecasts\`;`);

    this.addSql(`drop table if exists \`special_day_zones\`;`);

    this.addSql(`drop table if exists \`zone_station_weights\`;`);

    this.addSql(`alter table \`feed_keys\` drop index \`feed_keys_station_id_index\`;`);
    this.addSql(`alter table \`feed_keys\` drop column \`station_id\`;`);
  }

}
