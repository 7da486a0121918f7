import { Migration } from '@mikro-orm/migrations';

export class Migration20261201232126_teardown_workspace extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table \`devices\` (\`id\` integer not null primary key autoincrement, \`maker\` text not null, \`model\` text not null, \`category\` text check (\`category\` in ('pocket-heater', 'power-bank', 'headlamp', 'usb-fan', 'toothbrush', 'speaker', 'other')) not null, \`retail_price\` double null, \`retail_currency\` text null, \`price_seen_on\` text null, \`where_bought\` text null, \`claim_capacity_ah\` double null, \`claim_capacity_wh\` double null, \`claim_output_text\` text null, \`claim_output_watts\` double null, \`claim_runtime_h\` double null, \`claim_power_w\` double null, \`entered\` json null, \`notes\` text null, \`created_by_id\` integer null, \`created_at\` datetime not null, \`updated_at\` datetime not null, constraint \`devices_created_by_id_foreign\` foreign key(\`created_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(`create index \`devices_created_by_id_index\` on \`devices\` (\`created_by_id\`);`);
    this.addSql(`create index \`devices_category_index\` on \`devices\` (\`category\`);`);
    this.addSql(`create index \`devices_maker_index\` on \`devices\` (\`maker\`);`);

    this.addSql(
      `create table \`teardowns\` (\`id\` integer not null primary key autoincrement, \`device_id\` integer not null, \`engineer_id\` integer not null, \`unit_label\` text null, \`date\` text not null, \`status\` text check (\`status\` in ('draft', 'in_review', 'published')) not null default 'draft', \`summary\` text null, \`safety_notes\` text null, \`contact_seconds\` integer null, \`version\` integer not null default 1, \`submitted_at\` datetime null, \`published_at\` datetime null, \`published_by_id\` integer null, \`last_review_note\` text null, \`created_at\` datetime not null, \`updated_at\` datetime not null, constraint \`teardowns_device_id_foreign\` foreign key(\`device_id\`) references \`devices\`(\`id\`) on delete cascade on update cascade, constraint \`teardowns_engineer_id_foreign\` foreign key(\`engineer_id\`) references \`users\`(\`id\`) on update cascade, constraint \`teardowns_published_by_id_foreign\` foreign key(\`published_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(`create index \`teardowns_device_id_index\` on \`teardowns\` (\`device_id\`);`);
    this.addSql(`create index \`teardowns_engineer_id_index\` on \`teardowns\` (\`engineer_id\`);`);
    this.addSql(`create index \`teardowns_published_by_id_index\` on \`teardowns\` (\`published_by_id\`);`);
    this.addSql(`create index \`teardowns_status_index\` on \`teardowns\` (\`status\`);`);

    this.addSql(
      `create table \`suggestion_decisions\` (\`id\` integer not null primary key autoincrement, \`teardown_id\` integer not null, \`key\` text not null, \`status\` text check (\`status\` in ('accepted', 'dismissed')) not null, \`finding_id\` integer null, \`decided_by_id\` integer null, \`decided_at\` datetime not null, constraint \`suggestion_decisions_teardown_id_foreign\` foreign key(\`teardown_id\`) references \`teardowns\`(\`id\`) on delete cascade on update cascade, constraint \`suggestion_decisions_decided_by_id_foreign\` foreign key(\`decided_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(`create index \`suggestion_decisions_teardown_id_index\` on \`suggestion_decisions\` (\`teardown_id\`);`);
    this.addSql(`create index \`suggestion_decisions_decided_by_id_index\` on \`suggestion_decisions\` (\`decided_by_id\`);`);
    this.addSql(`create unique index \`suggestion_decisions_teardown_id_key_unique\` on \`suggestion_decisions\` (\`teardown_id\`, \`key\`);`);

    this.addSql(
      `create table \`photos\` (\`id\` integer not null primary key autoincrement, \`teardown_id\` integer not null, \`storage_key\` text not null, \`original_name\` text not null, \`mime\` text not null, \`original_ext\` text not null, \`width\` integer not null, \`height\` integer not null, \`bytes\` integer not null, \`caption\` text null, \`layer\` integer not null default 1, \`step\` integer not null default 1, \`uploaded_by_id\` integer null, \`created_at\` datetime not null, constraint \`photos_teardown_id_foreign\` foreign key(\`teardown_id\`) references \`teardowns\`(\`id\`) on delete cascade on update cascade, constraint \`photos_uploaded_by_id_foreign\` foreign key(\`uploaded_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(`create index \`photos_teardown_id_index\` on \`photos\` (\`teardown_id\`);`);
    this.addSql(`create unique index \`photos_storage_key_unique\` on \`photos\` (\`storage_key\`);`);
    this.addSql(`create index \`photos_uploaded_by_id_index\` on \`photos\` (\`uploaded_by_id\`);`);

    this.addSql(
      `create table \`parts\` (\`id\` integer not null primary key autoincrement, \`teardown_id\` integer not null, \`position\` integer not null default 0, \`designators\` text null, \`category\` text check (\`category\` in ('cell', 'ic', 'passive', 'inductor', 'semiconductor', 'connector', 'pcb', 'heater', 'sensor', 'switch', 'led', 'motor', 'wire', 'enclosure', 'fastener', 'label', 'packaging', 'other')) not null, \`description\` text not null, \`marking\` text null, \`decoded_value\` double null, \`decoded_unit\` text null, \`maker_part_number\` text null, \`package\` text null, \`quantity\` integer not null default 1, \`mount\` text check (\`mount\` in ('smt', 'tht', 'manual')) not null default 'smt', \`notes\` text null, \`created_at\` datetime not null, \`updated_at\` datetime not null, constraint \`parts_teardown_id_foreign\` foreign key(\`teardown_id\`) references \`teardowns\`(\`id\`) on delete cascade on update cascade);`,
    );
    this.addSql(`create index \`parts_teardown_id_index\` on \`parts\` (\`teardown_id\`);`);
    this.addSql(`create index \`parts_category_index\` on \`parts\` (\`category\`);`);

    this.addSql(
      `create table \`packs\` (\`id\` integer not null primary key autoincrement, \`teardown_id\` integer not null, \`chemistry\` text check (\`chemistry\` in ('li-ion', 'li-po', 'lifepo4', 'lto', 'nimh', 'alkaline', 'other')) not null, \`cell_format\` text null, \`cell_nominal_volts\` double not null, \`cell_max_volts\` double null, \`cell_rated_ah\` double not null, \`cell_measured_ah\` double null, \`series\` integer not null default 1, \`parallel\` integer not null default 1, \`pack_mass_kg\` double null, \`protection\` integer not null default false, \`joining\` text check (\`joining\` in ('welded-tab', 'soldered', 'holder', 'connector', 'other')) null, \`entered\` json null, \`updated_at\` datetime not null, constraint \`packs_teardown_id_foreign\` foreign key(\`teardown_id\`) references \`teardowns\`(\`id\`) on delete cascade on update cascade);`,
    );
    this.addSql(`create unique index \`packs_teardown_id_unique\` on \`packs\` (\`teardown_id\`);`);

    this.addSql(
      `create table \`measurements\` (\`id\` integer not null primary key autoincrement, \`teardown_id\` integer not null, \`quantity\` text check (\`quantity\` in ('voltage', 'current', 'resistance', 'capacitance', 'inductance', 'power', 'energy', 'capacity', 'temperature', 'mass', 'length', 'time', 'frequency', 'other')) not null, \`value\` double not null, \`unit\` text not null, \`entered\` text not null, \`subject\` text not null, \`conditions\` text null, \`instrument\` text null, \`uncertainty\` text null, \`taken_by_id\` integer null, \`taken_at\` datetime not null, constraint \`measurements_teardown_id_foreign\` foreign key(\`teardown_id\`) references \`teardowns\`(\`id\`) on delete cascade on update cascade, constraint \`measurements_taken_by_id_foreign\` foreign key(\`taken_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(`create index \`measurements_teardown_id_index\` on \`measurements\` (\`teardown_id\`);`);
    this.addSql(`create index \`measurements_taken_by_id_index\` on \`measurements\` (\`taken_by_id\`);`);

    this.addSql(
      `create table \`findings\` (\`id\` integer not null primary key autoincrement, \`teardown_id\` integer not null, \`kind\` text check (\`kind\` in ('cost-down', 'safety', 'reliability', 'manufacturability', 'user-experience', 'compliance', 'clever-idea')) not null, \`severity\` text check (\`severity\` in ('note', 'minor', 'major', 'critical')) not null, \`text\` text not null, \`tags\` json not null, \`suggestion_key\` text null, \`created_by_id\` integer null, \`created_at\` datetime not null, \`updated_at\` datetime not null, constraint \`findings_teardown_id_foreign\` foreign key(\`teardown_id\`) references \`teardowns\`(\`id\`) on delete cascade on update cascade, constraint \`findings_created_by_id_foreign\` foreign key(\`created_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(`create index \`findings_teardown_id_index\` on \`findings\` (\`teardown_id\`);`);
    this.addSql(`create index \`findings_created_by_id_index\` on \`findings\` (\`created_by_id\`);`);
    this.addSql(`create index \`findings_kind_index\` on \`findings\` (\`kind\`);`);
    this.addSql(`create index \`findings_severity_index\` on \`findings\` (\`severity\`);`);

    this.addSql(
      `create table \`finding_photos\` (\`finding_id\` integer not null, \`photo_id\` integer not null, constraint \`finding_photos_finding_id_foreign\` foreign key(\`finding_id\`) references \`findings\`(\`id\`) on delete cascade on update cascade, constraint \`finding_photos_photo_id_foreign\` foreign key(\`photo_id\`) references \`photos\`(\`id\`) on delete cascade on update cascade, primary key (\`finding_id\`, \`photo_id\`));`,
    );
    this.addSql(`create index \`finding_photos_finding_id_index\` on \`finding_photos\` (\`finding_id\`);`);
    this.addSql(`create index \`finding_photos_photo_id_index\` on \`finding_photos\` (\`photo_id\`);`);

    this.addSql(
      `create table \`finding_parts\` (\`finding_id\` integer not null, \`part_id\` integer not null, constraint \`finding_parts_finding_id_foreign\` foreign key(\`finding_id\`) references \`findings\`(\`id\`) on delete cascade on update cascade, constraint \`finding_parts_part_id_foreign\` foreign key(\`part_id\`) references \`parts\`(\`id\`) on delete cascade on update cascade, primary key (\`finding_id\`, \`part_id\`));`,
    );
    this.addSql(`create index \`finding_parts_finding_id_index\` on \`finding_parts\` (\`finding_id\`);`);
    this.addSql(`create index \`finding_parts_part_id_index\` on \`finding_parts\` (\`part_id\`);`);

    this.addSql(
      `create table \`callouts\` (\`id\` integer not null primary key autoincrement, \`photo_id\` integer not null, \`number\` integer not null, \`x\` double not null, \`y\` double not null, \`label\` text not null, \`part_id\` integer null, \`finding_id\` integer null, \`created_at\` datetime not null, constraint \`callouts_photo_id_foreign\` foreign key(\`photo_id\`) references \`photos\`(\`id\`) on delete cascade on update cascade, constraint \`callouts_part_id_foreign\` foreign key(\`part_id\`) references \`parts\`(\`id\`) on delete set null on update cascade, constraint \`callouts_finding_id_foreign\` foreign key(\`finding_id\`) references \`findings\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(`create index \`callouts_photo_id_index\` on \`callouts\` (\`photo_id\`);`);
    this.addSql(`create index \`callouts_part_id_index\` on \`callouts\` (\`part_id\`);`);
    this.addSql(`create index \`callouts_finding_id_index\` on \`callouts\` (\`finding_id\`);`);
    this.addSql(`create unique index \`callouts_photo_id_number_unique\` on \`callouts\` (\`photo_id\`, \`number\`);`);

    this.addSql(
      `create table \`converters\` (\`id\` integer not null primary key autoincrement, \`teardown_id\` integer not null, \`label\` text not null, \`topology\` text check (\`topology\` in ('buck', 'boost', 'buck-boost')) not null, \`role\` text check (\`role\` in ('charge', 'output', 'load')) not null, \`vin\` double not null, \`vout\` double not null, \`rated_current_a\` double null, \`charge_current_a\` double null, \`efficiency\` double null, \`efficiency_source\` text check (\`efficiency_source\` in ('measured', 'assumed')) not null default 'assumed', \`entered\` json null, \`created_at\` datetime not null, constraint \`converters_teardown_id_foreign\` foreign key(\`teardown_id\`) references \`teardowns\`(\`id\`) on delete cascade on update cascade);`,
    );
    this.addSql(`create index \`converters_teardown_id_index\` on \`converters\` (\`teardown_id\`);`);

    this.addSql(
      `create table \`loads\` (\`id\` integer not null primary key autoincrement, \`teardown_id\` integer not null, \`kind\` text check (\`kind\` in ('heater', 'motor', 'led', 'usb-output', 'other')) not null, \`label\` text not null, \`resistance_ohms\` double null, \`current_amps\` double null, \`power_watts\` double null, \`supply_volts\` double null, \`count\` integer not null default 1, \`connection\` text check (\`connection\` in ('series', 'parallel')) not null default 'parallel', \`duty\` double not null default 1, \`converter_id\` integer null, \`heated_area_m2\` double null, \`surface_material\` text check (\`surface_material\` in ('metal', 'glass', 'plastic')) null, \`entered\` json null, \`created_at\` datetime not null, constraint \`loads_teardown_id_foreign\` foreign key(\`teardown_id\`) references \`teardowns\`(\`id\`) on delete cascade on update cascade, constraint \`loads_converter_id_foreign\` foreign key(\`converter_id\`) references \`converters\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(`create index \`loads_teardown_id_index\` on \`loads\` (\`teardown_id\`);`);
    this.addSql(`create index \`loads_converter_id_index\` on \`loads\` (\`converter_id\`);`);

    this.addSql(
      `create table \`comments\` (\`id\` integer not null primary key autoincrement, \`teardown_id\` integer not null, \`author_id\` integer null, \`kind\` text check (\`kind\` in ('comment', 'sent-back', 'approved', 'submitted')) not null default 'comment', \`body\` text not null, \`created_at\` datetime not null, constraint \`comments_teardown_id_foreign\` foreign key(\`teardown_id\`) references \`teardowns\`(\`id\`) on delete cascade on update cascade, constraint \`comments_author_id_foreign\` foreign key(\`author_id\`) references \`users\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(`create index \`comments_teardown_id_index\` on \`comments\` (\`teardown_id\`);`);
    this.addSql(`create index \`comments_author_id_index\` on \`comments\` (\`author_id\`);`);

    this.addSql(`pragma foreign_keys = off;`);
    this.addSql(
      `create table \`users__temp_alter\` (\`id\` integer not null primary key autoincrement, \`email\` text not null, \`name\` text not null, \`role\` text check (\`role\` in ('admin', 'engineer', 'sourcing', 'lead', 'viewer')) not null, \`password_hash\` text not null, \`active\` integer not null default true, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`last_sign_in_at\` datetime null);`,
    );
    this.addSql(`insert into \`users__temp_alter\` select \`id\`, \`email\`, \`name\`, \`role\`, \`password_hash\`, \`active\`, \`created_at\`, \`updated_at\`, \`last_sign_in_at\` from \`users\`;`);
    this.addSql(`drop table \`users\`;`);
    this.addSql(`alter table \`users__temp_alter\` rename to \`users\`;`);
    this.addSql(`create unique index \`users_email_unique\` on \`users\` (\`email\`);`);
    this.addSql(`pragma foreign_keys = on;pragma foreign_keys = off;`);
    this.addSql(
      `create table \`invitations__temp_alter\` (\`id\` integer not null primary key autoincrement, \`email\` text not null, \`role\` text check (\`role\` in ('admin', 'engineer', 'sourcing', 'lead', 'viewer')) not null, \`token_hash\` text not null, \`invited_by_id\` integer null, \`created_at\` datetime not null, \`expires_at\` datetime not null, \`accepted_at\` datetime null, \`revoked_at\` datetime null, constraint \`invitations_invited_by_id_foreign\` foreign key(\`invited_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(
      `insert into \`invitations__temp_alter\` select \`id\`, \`email\`, \`role\`, \`token_hash\`, \`invited_by_id\`, \`created_at\`, \`expires_at\`, \`accepted_at\`, \`revoked_at\` from \`invitations\`;`,
    );
    this.addSql(`drop table \`invitations\`;`);
    this.addSql(`alter table \`invitations__temp_alter\` rename to \`invitations\`;`);
    this.addSql(`create unique index \`invitations_token_hash_unique\` on \`invitations\` (\`token_hash\`);`);
    this.addSql(`create index \`invitations_invited_by_id_index\` on \`invitations\` (\`invited_by_id\`);`);
    this.addSql(`pragma foreign_keys = on;`);
  }
}
