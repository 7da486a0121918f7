import { Migration } from '@mikro-orm/migrations';

export class Migration20261201232432_settings extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table \`settings\` (\`key\` text not null, \`value\` json not null, \`updated_by_id\` integer null, \`updated_at\` datetime not null, constraint \`settings_updated_by_id_foreign\` foreign key(\`updated_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade, primary key (\`key\`));`,
    );
    this.addSql(`create index \`settings_updated_by_id_index\` on \`settings\` (\`updated_by_id\`);`);
  }
}
