import { Migration } from '@mikro-orm/migrations';

// Full-text search (findings explorer): one FTS5 table over findings, parts, teardowns (device name,
// unit, summary, safety notes) and comments, kept in step by triggers, and filled from the rows that
// exist. Hand-written: the schema diff skips tables matching /_fts/.
//
// Row ids are derived from the record: id × 4 + 0 finding, 1 part, 2 teardown, 3 comment, so a
// trigger finds its row by rowid instead of scanning UNINDEXED columns. The snippet markers of the
// search API (U+0002, U+0003) are removed from the indexed text so stored text can never fake a hit.

const clean = (sql: string) => `replace(replace(coalesce(${sql}, ''), char(2), ''), char(3), '')`;
const tagText = (col: string) => `(case when json_valid(${col}) then (select coalesce(group_concat(value, ' '), '') from json_each(${col})) else '' end)`;
const join = (...cols: string[]) => clean(`concat_ws(' ', ${cols.map((c) => `nullif(trim(${c}), '')`).join(', ')})`);

const COLS = '(rowid, title, body, detail, tags, type, record_id, teardown_id)';

/** The search row of each kind of record, as a SELECT over `r` (the record) — used by triggers and the backfill. */
const ROWS = {
  finding: (r: string) => `select ${r}.id * 4 + 0, '', ${clean(`${r}.text`)}, '', ${clean(tagText(`${r}.tags`))}, 'finding', ${r}.id, ${r}.teardown_id`,
  part: (r: string) =>
    `select ${r}.id * 4 + 1, ${clean(`${r}.description`)}, ${clean(`${r}.notes`)}, ${join(`${r}.designators`, `${r}.marking`, `${r}.maker_part_number`, `${r}.package`, `${r}.category`)}, '', 'part', ${r}.id, ${r}.teardown_id`,
  teardown: (r: string) =>
    `select ${r}.id * 4 + 2, ${join("(select d.maker || ' ' || d.model from devices d where d.id = " + r + '.device_id)', `${r}.unit_label`)}, ${clean(`${r}.summary`)}, ${clean(`${r}.safety_notes`)}, '', 'teardown', ${r}.id, ${r}.id`,
  comment: (r: string) => `select ${r}.id * 4 + 3, '', ${clean(`${r}.body`)}, '', '', 'comment', ${r}.id, ${r}.teardown_id`,
} as const;

const TABLES = [
  { type: 'finding', table: 'findings', offset: 0, watched: 'text, tags, teardown_id' },
  { type: 'part', table: 'parts', offset: 1, watched: 'description, notes, designators, marking, maker_part_number, package, category, teardown_id' },
  { type: 'teardown', table: 'teardowns', offset: 2, watched: 'summary, safety_notes, unit_label, device_id' },
  { type: 'comment', table: 'comments', offset: 3, watched: 'body, teardown_id' },
] as const;

export class Migration20261202004500_search_fts extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create virtual table \`search_fts\` using fts5(title, body, detail, tags, type unindexed, record_id unindexed, teardown_id unindexed, tokenize = 'unicode61 remove_diacritics 2', prefix = '2 3 4');`,
    );
    for (const t of TABLES) {
      const row = ROWS[t.type];
      this.addSql(`create trigger \`${t.table}_search_fts_ai\` after insert on \`${t.table}\` begin insert into search_fts ${COLS} ${row('new')}; end;`);
      this.addSql(
        `create trigger \`${t.table}_search_fts_au\` after update of ${t.watched} on \`${t.table}\` begin ` +
          `delete from search_fts where rowid = old.id * 4 + ${t.offset}; insert into search_fts ${COLS} ${row('new')}; end;`,
      );
      this.addSql(`create trigger \`${t.table}_search_fts_ad\` after delete on \`${t.table}\` begin delete from search_fts where rowid = old.id * 4 + ${t.offset}; end;`);
      this.addSql(`insert into search_fts ${COLS} ${row(t.table)} from \`${t.table}\`;`);
    }
    // A device renamed: its teardowns' titles follow.
    this.addSql(
      `create trigger \`devices_search_fts_au\` after update of maker, model on \`devices\` begin ` +
        `delete from search_fts where rowid in (select id * 4 + 2 from teardowns where device_id = new.id); ` +
        `insert into search_fts ${COLS} ${ROWS.teardown('teardowns')} from teardowns where teardowns.device_id = new.id; end;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql('drop trigger if exists `devices_search_fts_au`;');
    for (const t of TABLES) for (const s of ['ai', 'au', 'ad']) this.addSql(`drop trigger if exists \`${t.table}_search_fts_${s}\`;`);
    this.addSql('drop table if exists `search_fts`;');
  }
}
