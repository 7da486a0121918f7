import { Migration } from '@mikro-orm/migrations';

export class Migration20261203091404_user_session_epoch extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table \`users\` add column \`session_epoch\` integer not null default 0;`);
  }
}
