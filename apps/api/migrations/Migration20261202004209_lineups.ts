import { Migration } from '@mikro-orm/migrations';

export class Migration20261202004209_lineups extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table \`lineups\` (\`id\` integer not null primary key autoincrement, \`name\` text not null, \`description\` text null, \`currency\` text not null, \`weights\` json not null, \`status\` text check (\`status\` in ('draft', 'published')) not null default 'draft', \`created_by_id\` integer null, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`published_at\` datetime null, \`published_by_id\` integer null, \`version\` integer not null default 1, constraint \`lineups_created_by_id_foreign\` foreign key(\`created_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade, constraint \`lineups_published_by_id_foreign\` foreign key(\`published_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(`create index \`lineups_created_by_id_index\` on \`lineups\` (\`created_by_id\`);`);
    this.addSql(`create index \`lineups_published_by_id_index\` on \`lineups\` (\`published_by_id\`);`);
    this.addSql(`create index \`lineups_status_index\` on \`lineups\` (\`status\`);`);

    this.addSql(
      `create table \`lineup_devices\` (\`id\` integer not null primary key autoincrement, \`lineup_id\` integer not null, \`device_id\` integer not null, \`position\` integer not null, constraint \`lineup_devices_lineup_id_foreign\` foreign key(\`lineup_id\`) references \`lineups\`(\`id\`) on delete cascade on update cascade, constraint \`lineup_devices_device_id_foreign\` foreign key(\`device_id\`) references \`devices\`(\`id\`) on delete cascade on update cascade);`,
    );
    this.addSql(`create index \`lineup_devices_lineup_id_index\` on \`lineup_devices\` (\`lineup_id\`);`);
    this.addSql(`create index \`lineup_devices_device_id_index\` on \`lineup_devices\` (\`device_id\`);`);
    this.addSql(`create unique index \`lineup_devices_lineup_id_device_id_unique\` on \`lineup_devices\` (\`lineup_id\`, \`device_id\`);`);
  }
}
