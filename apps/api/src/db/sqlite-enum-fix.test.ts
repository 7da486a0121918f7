import { describe, expect, it } from 'vitest';
import { parseSqliteEnumChecks } from './sqlite-enum-fix';

describe('parseSqliteEnumChecks', () => {
  it('reads every item of each enum check constraint', () => {
    const sql =
      "create table `t` (`id` integer not null primary key, `role` text check (`role` in ('admin', 'engineer', 'sourcing', 'lead', 'viewer')) not null, `status` text check (`status` in ('draft','in_review','published')) not null default 'draft', `q` text check (`q` in ('it''s', 'b')) null)";
    expect(parseSqliteEnumChecks(sql)).toEqual({
      role: ['admin', 'engineer', 'sourcing', 'lead', 'viewer'],
      status: ['draft', 'in_review', 'published'],
      q: ["it's", 'b'],
    });
  });
});
