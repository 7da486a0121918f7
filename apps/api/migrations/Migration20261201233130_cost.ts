import { Migration } from '@mikro-orm/migrations';

export class Migration20261201233130_cost extends Migration {
  // Only the cost module's own tables. (The generator also proposed rebuilding every other table
  // with identical columns, a known quirk of its SQLite diff; those statements were left out.)
  override async up(): Promise<void> {
    this.addSql(
      `create table \`rate_tables\` (\`id\` integer not null primary key autoincrement, \`base\` text not null, \`date\` text not null, \`source\` text not null, \`kind\` text check (\`kind\` in ('import', 'manual', 'demo')) not null, \`rates\` json not null, \`note\` text null, \`created_by_id\` integer null, \`created_at\` datetime not null, constraint \`rate_tables_created_by_id_foreign\` foreign key(\`created_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(`create index \`rate_tables_created_by_id_index\` on \`rate_tables\` (\`created_by_id\`);`);
    this.addSql(`create index \`rate_tables_date_index\` on \`rate_tables\` (\`date\`);`);

    this.addSql(
      `create table \`part_prices\` (\`id\` integer not null primary key autoincrement, \`part_id\` integer not null, \`currency\` text not null, \`breaks\` json not null, \`source\` text check (\`source\` in ('quote', 'catalogue', 'marketplace', 'estimate')) not null, \`confidence\` text check (\`confidence\` in ('high', 'medium', 'low')) not null, \`price_date\` text not null, \`note\` text null, \`updated_by_id\` integer null, \`updated_at\` datetime not null, constraint \`part_prices_part_id_foreign\` foreign key(\`part_id\`) references \`parts\`(\`id\`) on delete cascade on update cascade, constraint \`part_prices_updated_by_id_foreign\` foreign key(\`updated_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(`create unique index \`part_prices_part_id_unique\` on \`part_prices\` (\`part_id\`);`);
    this.addSql(`create index \`part_prices_updated_by_id_index\` on \`part_prices\` (\`updated_by_id\`);`);

    this.addSql(
      `create table \`cost_models\` (\`id\` integer not null primary key autoincrement, \`teardown_id\` integer null, \`model\` json not null, \`updated_by_id\` integer null, \`updated_at\` datetime not null, constraint \`cost_models_teardown_id_foreign\` foreign key(\`teardown_id\`) references \`teardowns\`(\`id\`) on delete cascade on update cascade, constraint \`cost_models_updated_by_id_foreign\` foreign key(\`updated_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(`create unique index \`cost_models_teardown_id_unique\` on \`cost_models\` (\`teardown_id\`);`);
    this.addSql(`create index \`cost_models_updated_by_id_index\` on \`cost_models\` (\`updated_by_id\`);`);
  }
}
