import { Migration } from '@mikro-orm/migrations';

/**
 * Model versions keep the share of hours their 80 % and 95 % bands held in the backtest that
 * scored them, beside its MAPE (null for versions scored before the bands were calibrated).
 */
export class Migration20261203050500 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table \`model_versions\` add \`backtest_coverage80\` double null, add \`backtest_coverage95\` double null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`model_versions\` drop column \`backtest_coverage80\`, drop column \`backtest_coverage95\`;`);
  }

}
