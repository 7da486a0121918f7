import { Migration } from '@mikro-orm/migrations';

export class Migration20261201230325_foundation extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table \`outbox_messages\` (\`id\` integer not null primary key autoincrement, \`received_at\` datetime not null, \`from\` text not null, \`to\` text not null, \`subject\` text not null, \`text\` text not null, \`html\` text null);`,
    );

    this.addSql(
      `create table \`users\` (\`id\` integer not null primary key autoincrement, \`email\` text not null, \`name\` text not null, \`role\` text check (\`role\` in ('admin', 'engineer', 'sourcing', 'lead', 'viewer')) not null, \`password_hash\` text not null, \`active\` integer not null default true, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`last_sign_in_at\` datetime null);`,
    );
    this.addSql(`create unique index \`users_email_unique\` on \`users\` (\`email\`);`);

    this.addSql(
      `create table \`password_reset_tokens\` (\`id\` integer not null primary key autoincrement, \`user_id\` integer not null, \`token_hash\` text not null, \`created_at\` datetime not null, \`expires_at\` datetime not null, \`used_at\` datetime null, constraint \`password_reset_tokens_user_id_foreign\` foreign key(\`user_id\`) references \`users\`(\`id\`) on delete cascade on update cascade);`,
    );
    this.addSql(`create index \`password_reset_tokens_user_id_index\` on \`password_reset_tokens\` (\`user_id\`);`);
    this.addSql(`create unique index \`password_reset_tokens_token_hash_unique\` on \`password_reset_tokens\` (\`token_hash\`);`);

    this.addSql(
      `create table \`invitations\` (\`id\` integer not null primary key autoincrement, \`email\` text not null, \`role\` text check (\`role\` in ('admin', 'engineer', 'sourcing', 'lead', 'viewer')) not null, \`token_hash\` text not null, \`invited_by_id\` integer null, \`created_at\` datetime not null, \`expires_at\` datetime not null, \`accepted_at\` datetime null, \`revoked_at\` datetime null, constraint \`invitations_invited_by_id_foreign\` foreign key(\`invited_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(`create unique index \`invitations_token_hash_unique\` on \`invitations\` (\`token_hash\`);`);
    this.addSql(`create index \`invitations_invited_by_id_index\` on \`invitations\` (\`invited_by_id\`);`);

    this.addSql(
      `create table \`audit_entries\` (\`id\` integer not null primary key autoincrement, \`at\` datetime not null, \`actor_id\` integer null, \`action\` text not null, \`entity_type\` text not null, \`entity_id\` text not null, \`scope_type\` text null, \`scope_id\` text null, \`summary\` text not null, \`changes\` json null, constraint \`audit_entries_actor_id_foreign\` foreign key(\`actor_id\`) references \`users\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(`create index \`audit_entries_actor_id_index\` on \`audit_entries\` (\`actor_id\`);`);
    this.addSql(`create index \`audit_entries_entity_type_entity_id_index\` on \`audit_entries\` (\`entity_type\`, \`entity_id\`);`);
    this.addSql(`create index \`audit_entries_scope_type_scope_id_index\` on \`audit_entries\` (\`scope_type\`, \`scope_id\`);`);
  }
}
