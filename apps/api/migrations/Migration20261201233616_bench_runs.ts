import { Migration } from '@mikro-orm/migrations';

// Bench runs only: the generator's no-op rebuilds of other modules' tables are left out on purpose.
export class Migration20261201233616_bench_runs extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table \`bench_runs\` (\`id\` integer not null primary key autoincrement, \`teardown_id\` integer not null, \`kind\` text check (\`kind\` in ('discharge', 'charge', 'thermal', 'power-bank')) not null, \`label\` text not null, \`file_name\` text not null, \`file_bytes\` integer not null, \`storage_key\` text not null, \`mapping\` json not null, \`samples\` integer not null, \`duration_s\` double not null, \`columns\` json not null, \`options\` json not null, \`analysis\` json not null, \`created_by_id\` integer null, \`created_at\` datetime not null, \`updated_at\` datetime not null, constraint \`bench_runs_teardown_id_foreign\` foreign key(\`teardown_id\`) references \`teardowns\`(\`id\`) on delete cascade on update cascade, constraint \`bench_runs_created_by_id_foreign\` foreign key(\`created_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(`create index \`bench_runs_teardown_id_index\` on \`bench_runs\` (\`teardown_id\`);`);
    this.addSql(`create unique index \`bench_runs_storage_key_unique\` on \`bench_runs\` (\`storage_key\`);`);
    this.addSql(`create index \`bench_runs_created_by_id_index\` on \`bench_runs\` (\`created_by_id\`);`);
    this.addSql(`create index \`bench_runs_kind_index\` on \`bench_runs\` (\`kind\`);`);
    this.addSql(`create index \`bench_runs_created_at_index\` on \`bench_runs\` (\`created_at\`);`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists \`bench_runs\`;`);
  }
}
