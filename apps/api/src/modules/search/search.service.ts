// The findings explorer's search: FTS5 over findings, parts, teardown summaries and comments
// (table search_fts, kept in step by triggers), the caller's role, facets and filters, sorting and
// paging.
//
// One SQL query reads the candidates: the rows that match the words (or every row, in browse
// mode) of teardowns the caller may read, with only the fields the filters and facets need.
// Filters and facet counts run over those rows here; a second query reads the text (title, lead,
// creation time) of the rows that pass, by rowid, for sorting and the results; snippets are made
// by FTS5 for the rows shown only. (Browse mode reads every row of the index for the facet
// counts: reading their text too took most of its time.)
import type { EntityManager } from '@mikro-orm/sqlite';
import {
  SEARCH_SECTION,
  SEARCH_SORT_DIR,
  SEARCH_TYPE,
  SEVERITY,
  FINDING_KIND,
  TEARDOWN_STATUS,
  searchTerms,
  type DeviceCategory,
  type FindingKind,
  type SearchFacets,
  type SearchItem,
  type SearchQuery,
  type SearchResponse,
  type SearchSort,
  type SearchType,
  type Severity,
  type SortDir,
  type TeardownStatus,
} from '@splitcase/contracts';
import type { AuthUser } from '../../http/route';
import { DRAFT_READERS } from '../teardowns/access';
import { BM25, SNIPPET, TYPE_BOOST, ftsMatch } from './fts';

interface CandidateRow {
  rowid: number;
  type: SearchType;
  record_id: number;
  teardown_id: number;
  rank: number;
  status: TeardownStatus;
  date: string;
  unit_label: string | null;
  device_id: number;
  maker: string;
  model: string;
  category: DeviceCategory;
  kind: FindingKind | null;
  severity: Severity | null;
  tags: string | null;
}

/** The text of a row that passed the filters. */
interface DetailRow {
  rowid: number;
  type: SearchType;
  date: string;
  unit_label: string | null;
  f_title: string;
  f_body: string;
  f_detail: string;
  designators: string | null;
  comment_kind: 'comment' | 'sent-back' | 'approved' | 'submitted' | null;
  author: string | null;
  created_at: number | string | null;
}

/** One candidate with what the filters, facets, sorting and the result row need. */
export interface Hit {
  rowid: number;
  type: SearchType;
  id: number;
  teardownId: number;
  deviceId: number;
  rank: number;
  title: string;
  /** Text shown when there is no FTS snippet (browse mode). */
  lead: string;
  status: TeardownStatus;
  date: string;
  month: string;
  unitLabel: string | null;
  maker: string;
  model: string;
  category: DeviceCategory;
  kind: FindingKind | null;
  severity: Severity | null;
  tags: string[];
  createdAt: Date;
}

const COMMENT_TITLE = { comment: 'Comment', 'sent-back': 'Sent back', approved: 'Approved', submitted: 'Submitted for review' } as const;

/** Cut text at a word boundary near `max` characters. */
export function clip(text: string, max: number): string {
  const t = text.replace(/\s+/g, ' ').trim();
  if (t.length <= max) return t;
  const cut = t.slice(0, max);
  const space = cut.lastIndexOf(' ');
  return `${(space > max * 0.6 ? cut.slice(0, space) : cut).replace(/[\s,;:.–-]+$/, '')}…`;
}

/** The first sentence (or clause) of a finding, for its title. */
export function firstSentence(text: string, max = 110): string {
  const t = text.replace(/\s+/g, ' ').trim();
  const m = t.match(/^(.{12,}?[.:;!?])(\s|$)/);
  const sentence = m ? m[1]!.replace(/[:;]$/, '') : t;
  return clip(sentence, max);
}

function parseTags(json: string | null): string[] {
  if (!json) return [];
  try {
    const v: unknown = JSON.parse(json);
    return Array.isArray(v) ? v.filter((x): x is string => typeof x === 'string') : [];
  } catch {
    return [];
  }
}

/** Title and lead of a row. */
function describe(r: DetailRow): { title: string; lead: string } {
  const body = r.f_body ?? '';
  switch (r.type) {
    case 'finding': {
      const title = firstSentence(body);
      const flat = body.replace(/\s+/g, ' ').trim();
      const rest = title.endsWith('…') ? `…${flat.slice(title.length - 1).trimStart()}` : flat.slice(title.length + 1).trim();
      return { title, lead: clip(rest || flat, 220) };
    }
    case 'part':
      return { title: r.designators ? `${r.designators} · ${r.f_title}` : r.f_title, lead: clip([body, r.f_detail].filter(Boolean).join(' · '), 220) };
    case 'teardown':
      return { title: `Teardown of ${r.unit_label ? `${r.unit_label}, ` : ''}${r.date}`, lead: clip(body || r.f_detail, 220) };
    case 'comment':
      return { title: `${COMMENT_TITLE[r.comment_kind ?? 'comment']} by ${r.author ?? 'a former user'}`, lead: clip(body, 220) };
  }
}

/** A candidate before its text is read: title, lead and creation time are filled by `withText`. */
type LightHit = Omit<Hit, 'title' | 'lead' | 'createdAt'>;

function toLightHit(r: CandidateRow): LightHit {
  return {
    rowid: r.rowid,
    type: r.type,
    id: Number(r.record_id),
    teardownId: Number(r.teardown_id),
    deviceId: r.device_id,
    rank: Number(r.rank) * TYPE_BOOST[r.type],
    status: r.status,
    date: r.date,
    month: r.date.slice(0, 7),
    unitLabel: r.unit_label,
    maker: r.maker,
    model: r.model,
    category: r.category,
    kind: r.kind,
    severity: r.severity,
    tags: r.type === 'finding' ? parseTags(r.tags) : [],
  };
}

/** The text columns of a row (DetailRow) and the joins they need, besides teardowns t and findings f. */
const TEXT_COLUMNS = `search_fts.title as f_title, substr(search_fts.body, 1, 600) as f_body, substr(search_fts.detail, 1, 300) as f_detail,
            p.designators as designators, c.kind as comment_kind, u.name as author,
            coalesce(f.created_at, p.created_at, c.created_at, t.created_at) as created_at`;
const TEXT_JOINS = `left join parts p on search_fts.type = 'part' and p.id = search_fts.record_id
       left join comments c on search_fts.type = 'comment' and c.id = search_fts.record_id
       left join users u on u.id = c.author_id`;

/**
 * Makes candidates hits, in their order, with their text: taken from `text` when the candidate
 * query read it, otherwise read here by rowid in chunks (and added to `text`).
 */
async function withText(em: EntityManager, light: LightHit[], text: Map<number, DetailRow>): Promise<Hit[]> {
  const missing = light.filter((h) => !text.has(h.rowid));
  for (let i = 0; i < missing.length; i += 500) {
    const chunk = missing.slice(i, i + 500);
    const rows = (await em.getConnection().execute(
      `select search_fts.rowid as rowid, search_fts.type as type, t.date as date, t.unit_label as unit_label, ${TEXT_COLUMNS}
         from search_fts
         join teardowns t on t.id = search_fts.teardown_id
         left join findings f on search_fts.type = 'finding' and f.id = search_fts.record_id
         ${TEXT_JOINS}
        where search_fts.rowid in (${chunk.map(() => '?').join(', ')})`,
      chunk.map((h) => h.rowid),
    )) as DetailRow[];
    for (const r of rows) text.set(Number(r.rowid), r);
  }
  return light.map((h) => {
    const r = text.get(h.rowid)!;
    const { title, lead } = describe(r);
    const created = r.created_at;
    return { ...h, title, lead, createdAt: new Date(typeof created === 'string' && !/^\d+$/.test(created) ? created : Number(created ?? 0)) };
  });
}

/**
 * The rows that match the words (all rows without words) of teardowns this user may read. With
 * words the rows are few and their text comes along; without (browse mode: every row, for the facet
 * counts) only what the filters and facets need, and `withText` reads the text of the rows that pass.
 */
async function candidates(em: EntityManager, user: AuthUser, terms: string[]): Promise<{ hits: LightHit[]; text: Map<number, DetailRow> }> {
  const where: string[] = [];
  const params: unknown[] = [];
  if (terms.length) {
    where.push('search_fts match ?');
    params.push(ftsMatch(terms));
  }
  if (!DRAFT_READERS.includes(user.role)) where.push(`t.status = 'published'`);
  const rows = (await em.getConnection().execute(
    `select search_fts.rowid as rowid, search_fts.type as type, search_fts.record_id as record_id, search_fts.teardown_id as teardown_id,
            ${terms.length ? BM25 : '0'} as rank,
            t.status as status, t.date as date, t.unit_label as unit_label,
            d.id as device_id, d.maker as maker, d.model as model, d.category as category,
            f.kind as kind, f.severity as severity, f.tags as tags${terms.length ? `, ${TEXT_COLUMNS}` : ''}
       from search_fts
       join teardowns t on t.id = search_fts.teardown_id
       join devices d on d.id = t.device_id
       left join findings f on search_fts.type = 'finding' and f.id = search_fts.record_id
       ${terms.length ? TEXT_JOINS : ''}
      ${where.length ? `where ${where.join(' and ')}` : ''}`,
    params,
  )) as (CandidateRow & Partial<DetailRow>)[];
  const text = new Map<number, DetailRow>();
  if (terms.length) for (const r of rows) text.set(Number(r.rowid), r as DetailRow);
  return { hits: rows.map(toLightHit), text };
}

type FilterKey = 'type' | 'kind' | 'severity' | 'category' | 'maker' | 'tag' | 'status' | 'device' | 'date';

/** Each filter as a test on a hit; an empty filter passes everything. */
function filtersOf(query: SearchQuery, types: SearchType[]): Record<FilterKey, (h: LightHit) => boolean> {
  const has = <T>(list: T[], v: T | null) => list.length === 0 || (v !== null && list.includes(v));
  return {
    type: (h) => has(types, h.type),
    kind: (h) => has(query.kind, h.kind),
    severity: (h) => has(query.severity, h.severity),
    category: (h) => has(query.category, h.category),
    maker: (h) => query.maker.length === 0 || query.maker.some((m) => m.toLowerCase() === h.maker.toLowerCase()),
    tag: (h) => query.tag.length === 0 || h.tags.some((t) => query.tag.includes(t.toLowerCase())),
    status: (h) => has(query.status, h.status),
    device: (h) => has(query.device, h.deviceId),
    date: (h) => (!query.from || h.date >= query.from) && (!query.to || h.date <= query.to),
  };
}

const FILTER_KEYS: FilterKey[] = ['type', 'kind', 'severity', 'category', 'maker', 'tag', 'status', 'device', 'date'];

/** What each facet counts, and which filter it leaves out when counting. */
const FACETS: { facet: keyof SearchFacets; skip: FilterKey; values: (h: LightHit) => (string | null)[] }[] = [
  { facet: 'type', skip: 'type', values: (h) => [h.type] },
  { facet: 'kind', skip: 'kind', values: (h) => [h.kind] },
  { facet: 'severity', skip: 'severity', values: (h) => [h.severity] },
  { facet: 'category', skip: 'category', values: (h) => [h.category] },
  { facet: 'maker', skip: 'maker', values: (h) => [h.maker] },
  { facet: 'tag', skip: 'tag', values: (h) => [...new Set(h.tags.map((t) => t.toLowerCase()))] },
  { facet: 'status', skip: 'status', values: (h) => [h.status] },
  { facet: 'month', skip: 'date', values: (h) => [h.month] },
];

const TYPE_ORDER = Object.fromEntries(SEARCH_TYPE.values.map((v, i) => [v, i])) as Record<SearchType, number>;
const SEVERITY_RANK = Object.fromEntries(SEVERITY.values.map((v, i) => [v, i])) as Record<Severity, number>;
const STATUS_ORDER = Object.fromEntries(TEARDOWN_STATUS.values.map((v, i) => [v, i])) as Record<TeardownStatus, number>;
const text = (a: string, b: string) => a.localeCompare(b, 'en', { sensitivity: 'base', numeric: true });

/** Compare two hits for a sort, ascending ("asc" order); null values are handled by the caller. */
const KEY_OF: Record<SearchSort, (h: Hit) => number | string | null> = {
  relevance: (h) => -h.rank, // bm25: lower is better; ascending "relevance" = worst first
  date: (h) => `${h.date}|${h.createdAt.toISOString()}`,
  severity: (h) => (h.severity ? SEVERITY_RANK[h.severity] : null),
  device: (h) => `${h.maker} ${h.model}`,
  type: (h) => TYPE_ORDER[h.type],
  kind: (h) => (h.kind ? FINDING_KIND.labels[h.kind] : null),
  status: (h) => STATUS_ORDER[h.status],
  title: (h) => h.title,
};

export function sortHits(hits: Hit[], sort: SearchSort, dir: SortDir): Hit[] {
  const key = KEY_OF[sort];
  const sign = dir === 'asc' ? 1 : -1;
  const cmp = (a: number | string, b: number | string) => (typeof a === 'number' && typeof b === 'number' ? a - b : text(String(a), String(b)));
  const tie = (a: Hit, b: Hit) => b.date.localeCompare(a.date) || b.createdAt.getTime() - a.createdAt.getTime() || TYPE_ORDER[a.type] - TYPE_ORDER[b.type] || a.id - b.id;
  return [...hits].sort((a, b) => {
    const ka = key(a);
    const kb = key(b);
    if (ka === null || kb === null) return ka === kb ? tie(a, b) : ka === null ? 1 : -1; // missing values last, either way
    return sign * cmp(ka, kb) || tie(a, b);
  });
}

export interface SearchResult {
  terms: string[];
  types: SearchType[];
  sort: SearchSort;
  dir: SortDir;
  hits: Hit[];
  facets: SearchFacets;
}

/** Match, filter, count facets and sort: every hit of the query, in order. */
export async function searchHits(em: EntityManager, user: AuthUser, query: SearchQuery): Promise<SearchResult> {
  const terms = searchTerms(query.q);
  // Browse mode (no words) lists findings unless the caller asks for other types.
  const types: SearchType[] = query.type.length ? [...new Set(query.type)] : terms.length ? [] : ['finding'];
  const { hits: all, text } = await candidates(em, user, terms);
  const filters = filtersOf(query, types);
  const active = FILTER_KEYS.map((k) => [k, filters[k]] as const);

  // A facet counts the hits that pass every filter but its own: find each hit's failing filters once.
  const facets = Object.fromEntries(FACETS.map((f) => [f.facet, {} as Record<string, number>])) as SearchFacets;
  const passing: LightHit[] = [];
  for (const h of all) {
    let failed: FilterKey | null = null;
    let failures = 0;
    for (const [k, test] of active) {
      if (test(h)) continue;
      failed = k;
      if (++failures > 1) break;
    }
    if (failures > 1) continue;
    if (failures === 0) passing.push(h);
    for (const f of FACETS) {
      if (failures === 1 && f.skip !== failed) continue;
      for (const v of f.values(h)) if (v !== null) facets[f.facet][v] = (facets[f.facet][v] ?? 0) + 1;
    }
  }
  // A chosen value stays listed (with 0) even when nothing matches it any more.
  const chosen: [keyof SearchFacets, string[]][] = [
    ['type', types],
    ['kind', query.kind],
    ['severity', query.severity],
    ['category', query.category],
    ['maker', query.maker],
    ['tag', query.tag],
    ['status', query.status],
  ];
  for (const [facet, values] of chosen) for (const v of values) facets[facet][v] ??= 0;

  const sort: SearchSort = query.sort ?? (terms.length ? 'relevance' : 'date');
  const effectiveSort: SearchSort = sort === 'relevance' && !terms.length ? 'date' : sort;
  const dir: SortDir = query.dir ?? SEARCH_SORT_DIR[sort];
  const hits = sortHits(await withText(em, passing, text), effectiveSort, effectiveSort === sort ? dir : SEARCH_SORT_DIR[effectiveSort]);
  return { terms, types, sort, dir, hits, facets };
}

/** FTS5 snippets of these hits for the words (rowid → snippet with hit markers). */
export async function snippetsFor(em: EntityManager, terms: string[], hits: Hit[]): Promise<Map<number, string>> {
  const out = new Map<number, string>();
  if (!terms.length || !hits.length) return out;
  const match = ftsMatch(terms);
  for (let i = 0; i < hits.length; i += 500) {
    const chunk = hits.slice(i, i + 500);
    const rows = (await em
      .getConnection()
      .execute(`select rowid, ${SNIPPET} as snippet from search_fts where search_fts match ? and rowid in (${chunk.map(() => '?').join(', ')})`, [match, ...chunk.map((h) => h.rowid)])) as {
      rowid: number;
      snippet: string;
    }[];
    for (const r of rows) out.set(Number(r.rowid), r.snippet);
  }
  return out;
}

export function toSearchItem(h: Hit, snippet: string | undefined): SearchItem {
  return {
    type: h.type,
    id: h.id,
    teardownId: h.teardownId,
    deviceId: h.deviceId,
    title: h.title,
    snippet: snippet && snippet.trim() ? snippet : h.lead,
    section: SEARCH_SECTION[h.type],
    device: { maker: h.maker, model: h.model, category: h.category },
    teardown: { status: h.status, date: h.date, unitLabel: h.unitLabel },
    kind: h.kind,
    severity: h.severity,
    tags: h.tags,
    createdAt: h.createdAt.toISOString(),
  };
}

/** GET /api/search: one page of results with the facets of the whole result set. */
export async function search(em: EntityManager, user: AuthUser, query: SearchQuery): Promise<SearchResponse> {
  const r = await searchHits(em, user, query);
  const page = r.hits.slice(query.offset, query.offset + query.limit);
  const snippets = await snippetsFor(em, r.terms, page);
  return {
    total: r.hits.length,
    items: page.map((h) => toSearchItem(h, snippets.get(h.rowid))),
    facets: r.facets,
    mode: r.terms.length ? 'search' : 'browse',
    terms: r.terms,
    types: r.types,
    sort: r.sort,
    dir: r.dir,
    limit: query.limit,
    offset: query.offset,
  };
}
