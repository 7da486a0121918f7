import { Migration } from '@mikro-orm/migrations';

export class Migration20261203093745_modes_and_bench_figures extends Migration {
  override async up(): Promise<void> {
    // loads: the surface-material check gains coated metal and wood, and the element material and heated
    // mass arrive; SQLite changes a check only by rebuilding the table (loads has no search triggers).
    this.addSql(`pragma foreign_keys = off;`);
    this.addSql(
      `create table \`loads__temp_alter\` (\`id\` integer not null primary key autoincrement, \`teardown_id\` integer not null, \`kind\` text check (\`kind\` in ('heater', 'motor', 'led', 'usb-output', 'other')) not null, \`label\` text not null, \`resistance_ohms\` double null, \`current_amps\` double null, \`power_watts\` double null, \`supply_volts\` double null, \`count\` integer not null default 1, \`connection\` text check (\`connection\` in ('series', 'parallel')) not null default 'parallel', \`duty\` double not null default 1, \`converter_id\` integer null, \`heated_area_m2\` double null, \`surface_material\` text check (\`surface_material\` in ('metal', 'metal-coated', 'glass', 'plastic', 'wood')) null, \`element_material\` text check (\`element_material\` in ('copper', 'other')) null, \`heated_mass_kg\` double null, \`entered\` json null, \`created_at\` datetime not null, constraint \`loads_teardown_id_foreign\` foreign key(\`teardown_id\`) references \`teardowns\`(\`id\`) on delete cascade on update cascade, constraint \`loads_converter_id_foreign\` foreign key(\`converter_id\`) references \`converters\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(
      `insert into \`loads__temp_alter\` select \`id\`, \`teardown_id\`, \`kind\`, \`label\`, \`resistance_ohms\`, \`current_amps\`, \`power_watts\`, \`supply_volts\`, \`count\`, \`connection\`, \`duty\`, \`converter_id\`, \`heated_area_m2\`, \`surface_material\`, null, null, \`entered\`, \`created_at\` from \`loads\`;`,
    );
    this.addSql(`drop table \`loads\`;`);
    this.addSql(`alter table \`loads__temp_alter\` rename to \`loads\`;`);
    this.addSql(`create index \`loads_teardown_id_index\` on \`loads\` (\`teardown_id\`);`);
    this.addSql(`create index \`loads_converter_id_index\` on \`loads\` (\`converter_id\`);`);
    this.addSql(`pragma foreign_keys = on;`);

    this.addSql(
      `create table \`operating_modes\` (\`id\` integer not null primary key autoincrement, \`teardown_id\` integer not null, \`name\` text not null, \`note\` text null, \`position\` integer not null default 0, \`quiescent_amps\` double null, \`entered\` json null, \`created_at\` datetime not null, constraint \`operating_modes_teardown_id_foreign\` foreign key(\`teardown_id\`) references \`teardowns\`(\`id\`) on delete cascade on update cascade);`,
    );
    this.addSql(`create index \`operating_modes_teardown_id_index\` on \`operating_modes\` (\`teardown_id\`);`);

    this.addSql(
      `create table \`mode_loads\` (\`id\` integer not null primary key autoincrement, \`mode_id\` integer not null, \`load_id\` integer not null, \`duty\` double not null default 1, \`entered\` text null, constraint \`mode_loads_mode_id_foreign\` foreign key(\`mode_id\`) references \`operating_modes\`(\`id\`) on delete cascade on update cascade, constraint \`mode_loads_load_id_foreign\` foreign key(\`load_id\`) references \`loads\`(\`id\`) on delete cascade on update cascade);`,
    );
    this.addSql(`create index \`mode_loads_mode_id_index\` on \`mode_loads\` (\`mode_id\`);`);
    this.addSql(`create index \`mode_loads_load_id_index\` on \`mode_loads\` (\`load_id\`);`);
    this.addSql(`create unique index \`mode_loads_mode_id_load_id_unique\` on \`mode_loads\` (\`mode_id\`, \`load_id\`);`);

    this.addSql(`alter table \`lineups\` add column \`mode_choice\` json null;`);

    this.addSql(`alter table \`packs\` add column \`internal_ohms\` double null;`);
    this.addSql(`alter table \`packs\` add column \`internal_readings\` json null;`);

    this.addSql(`pragma foreign_keys = off;`);
    this.addSql(
      `create table \`measurements__temp_alter\` (\`id\` integer not null primary key autoincrement, \`teardown_id\` integer not null, \`quantity\` text check (\`quantity\` in ('voltage', 'current', 'resistance', 'capacitance', 'inductance', 'power', 'energy', 'capacity', 'temperature', 'surface-temperature', 'mass', 'length', 'time', 'frequency', 'other')) not null, \`value\` double not null, \`unit\` text not null, \`entered\` text not null, \`subject\` text not null, \`conditions\` text null, \`instrument\` text null, \`uncertainty\` text null, \`taken_by_id\` integer null, \`taken_at\` datetime not null, constraint \`measurements_teardown_id_foreign\` foreign key(\`teardown_id\`) references \`teardowns\`(\`id\`) on delete cascade on update cascade, constraint \`measurements_taken_by_id_foreign\` foreign key(\`taken_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade);`,
    );
    this.addSql(
      `insert into \`measurements__temp_alter\` select \`id\`, \`teardown_id\`, \`quantity\`, \`value\`, \`unit\`, \`entered\`, \`subject\`, \`conditions\`, \`instrument\`, \`uncertainty\`, \`taken_by_id\`, \`taken_at\` from \`measurements\`;`,
    );
    this.addSql(`drop table \`measurements\`;`);
    this.addSql(`alter table \`measurements__temp_alter\` rename to \`measurements\`;`);
    this.addSql(`create index \`measurements_teardown_id_index\` on \`measurements\` (\`teardown_id\`);`);
    this.addSql(`create index \`measurements_taken_by_id_index\` on \`measurements\` (\`taken_by_id\`);`);
    this.addSql(`pragma foreign_keys = on;`);
  }
}
