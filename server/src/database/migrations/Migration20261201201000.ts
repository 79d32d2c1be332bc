import { Migration } from '@mikro-orm/migrations';

/** Outages and bad-data windows, refit jobs, model versions and forecast runs. */
export class Migration20261201201000 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`refit_jobs\` (\`id\` int unsigned not null auto_increment primary key, \`zone_id\` int unsigned not null, \`active_zone_id\` int unsigned null, \`trigger\` enum('schedule', 'operator', 'update') not null, \`mode\` enum('full', 'update') not null, \`reason\` text null, \`state\` enum('queued', 'running', 'done', 'failed') not null default 'queued', \`progress\` int not null default 0, \`stage\` varchar(120) not null default 'waiting for a worker', \`message\` text null, \`requested_by_id\` int null, \`requested_by_email\` varchar(254) null, \`created_at\` datetime(3) not null, \`started_at\` datetime(3) null, \`finished_at\` datetime(3) null, \`model_version_id\` int null, \`forecast_run_id\` int null, \`promoted\` tinyint(1) not null default false) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`refit_jobs\` add index \`refit_jobs_zone_id_index\`(\`zone_id\`);`);
    this.addSql(`alter table \`refit_jobs\` add unique \`refit_jobs_active_zone_id_unique\`(\`active_zone_id\`);`);
    this.addSql(`alter table \`refit_jobs\` add index \`refit_jobs_created_at_index\`(\`created_at\`);`);
    this.addSql(`alter table \`refit_jobs\` add index \`refit_jobs_state_index\`(\`state\`);`);

    this.addSql(`create table \`outages\` (\`id\` int unsigned not null auto_increment primary key, \`zone_id\` int unsigned not null, \`kind\` enum('outage', 'bad-data') not null, \`start\` datetime not null, \`end\` datetime null, \`note\` text not null, \`created_by_email\` varchar(254) null, \`created_at\` datetime(3) not null, \`updated_at\` datetime(3) not null, \`closed_at\` datetime(3) null, \`closed_by_email\` varchar(254) null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`outages\` add index \`outages_zone_id_index\`(\`zone_id\`);`);
    this.addSql(`alter table \`outages\` add index \`outages_zone_id_start_index\`(\`zone_id\`, \`start\`);`);

    this.addSql(`create table \`model_versions\` (\`id\` int unsigned not null auto_increment primary key, \`zone_id\` int unsigned not null, \`status\` enum('candidate', 'in-service', 'retired') not null default 'candidate', \`trigger\` enum('schedule', 'operator', 'update') not null, \`differencing\` json not null, \`differencing_label\` varchar(64) not null, \`p\` int not null, \`q\` int not null, \`coefficients\` json not null, \`parameters\` json not null, \`sigma2\` double not null, \`loglik\` double not null, \`aic\` double not null, \`aicc\` double not null, \`bic\` double not null, \`ljung_box\` json not null, \`residual_acf\` json not null, \`training_from\` datetime not null, \`training_to\` datetime not null, \`training_hours\` int not null, \`excluded_hours\` int not null, \`backtest_days\` int not null, \`backtest_mape\` double null, \`baseline_mape\` double null, \`warnings\` json not null, \`created_by_email\` varchar(254) null, \`created_at\` datetime(3) not null, \`duration_ms\` int not null, \`job_id\` int null, \`promoted_at\` datetime(3) null, \`retired_at\` datetime(3) null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`model_versions\` add index \`model_versions_zone_id_index\`(\`zone_id\`);`);
    this.addSql(`alter table \`model_versions\` add index \`model_versions_zone_id_status_index\`(\`zone_id\`, \`status\`);`);

    this.addSql(`create table \`forecast_runs\` (\`id\` int unsigned not null auto_increment primary key, \`zone_id\` int unsigned not null, \`issued_at\` datetime(3) not null, \`based_on_hour\` datetime null, \`method\` enum('arima', 'seasonal-naive') not null, \`fallback_reason\` text null, \`model_version_id\` int null, \`first_hour\` datetime not null, \`mean\` json not null, \`lower80\` json not null, \`upper80\` json not null, \`lower95\` json not null, \`upper95\` json not null) default character set utf8mb4 engine = InnoDB;`);
    this.addSql(`alter table \`forecast_runs\` add index \`forecast_runs_zone_id_index\`(\`zone_id\`);`);
    this.addSql(`alter table \`forecast_runs\` add index \`forecast_runs_zone_id_issued_at_index\`(\`zone_id\`, \`issued_at\`);`);

    this.addSql(`alter table \`refit_jobs\` add constraint \`refit_jobs_zone_id_foreign\` foreign key (\`zone_id\`) references \`zones\` (\`id\`) on update cascade on delete restrict;`);

    this.addSql(`alter table \`outages\` add constraint \`outages_zone_id_foreign\` foreign key (\`zone_id\`) references \`zones\` (\`id\`) on update cascade on delete restrict;`);

    this.addSql(`alter table \`model_versions\` add constraint \`model_versions_zone_id_foreign\` foreign key (\`zone_id\`) references \`zones\` (\`id\`) on update cascade on delete restrict;`);

    this.addSql(`alter table \`forecast_runs\` add constraint \`forecast_runs_zone_id_foreign\` foreign key (\`zone_id\`) references \`zones\` (\`id\`) on update cascade on delete restrict;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists \`refit_jobs\`;`);

    this.addSql(`drop table if exists \`outages\`;`);

    this.addSql(`drop table if exists \`model_versions\`;`);

    this.addSql(`drop table if exists \`forecast_runs\`;`);
  }

}
