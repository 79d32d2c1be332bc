import { Migration } from '@mikro-orm/migrations';

/**
 * Model versions keep the weather and calendar terms their refit tried: which were chosen, the
 * degree thresholds, the fitted response with its standard errors and the candidates' backtest
 * scores (null for versions fitted without observed temperature, and for those from before).
 */
export class Migration20261203120000 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table \`model_versions\` add \`weather\` json null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`model_versions\` drop column \`weather\`;`);
  }

}
