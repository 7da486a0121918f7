import { Migration } from '@mikro-orm/migrations';

export class Migration20261203085603_device_sales_tax extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table \`devices\` add column \`sales_tax_rate\` double null;`);
  }
}
