import { DEVICE_CATEGORY, FINDING_KIND, SEARCH_TYPE, SEVERITY, TEARDOWN_STATUS, patternsResponse, searchQuery, searchResponse, snippetText } from '@splitcase/contracts';
import { toCsv } from '../../lib/csv';
import { route, type RouteDef } from '../../http/route';
import { csvFileName } from '../parts/parts.service';
import { computePatterns } from './patterns.service';
import { search, searchHits, snippetsFor, toSearchItem } from './search.service';

const TAG = 'Findings explorer';
/** Rows in one CSV export at most (the whole result set of any realistic workspace). */
export const SEARCH_CSV_MAX_ROWS = 10_000;

const CSV_HEADER = ['Type', 'Title', 'Text', 'Maker', 'Model', 'Device category', 'Severity', 'Kind', 'Tags', 'Teardown status', 'Teardown date', 'Unit', 'Link'];

export const searchRoutes: RouteDef[] = [
  route(
    {
      method: 'get',
      path: '/api/search',
      tag: TAG,
      summary:
        'Full-text search over findings, parts, teardown summaries and safety notes, and comments (whole words and prefixes), with facets counted over the results; without q, findings are listed. Viewers: published teardowns only',
      access: 'signed-in',
      query: searchQuery,
      response: searchResponse,
    },
    ({ em, user, query }) => search(em, user, query),
  ),
  route(
    {
      method: 'get',
      path: '/api/search.csv',
      tag: TAG,
      summary: `The results of a search as CSV (same query as /api/search, every page, at most ${SEARCH_CSV_MAX_ROWS} rows; UTF-8 with BOM, CRLF, quoted fields, formula-safe)`,
      access: 'signed-in',
      query: searchQuery,
      produces: 'text/csv',
    },
    async ({ em, user, query, res, deps }) => {
      const r = await searchHits(em, user, query);
      const hits = r.hits.slice(0, SEARCH_CSV_MAX_ROWS);
      const snippets = await snippetsFor(em, r.terms, hits);
      const rows = hits.map((h) => {
        const item = toSearchItem(h, snippets.get(h.rowid));
        return [
          SEARCH_TYPE.labels[item.type],
          item.title,
          snippetText(item.snippet),
          item.device.maker,
          item.device.model,
          DEVICE_CATEGORY.labels[item.device.category],
          item.severity ? SEVERITY.labels[item.severity] : '',
          item.kind ? FINDING_KIND.labels[item.kind] : '',
          item.tags.join('; '),
          TEARDOWN_STATUS.labels[item.teardown.status],
          item.teardown.date,
          item.teardown.unitLabel ?? '',
          `${deps.env.publicUrl}/teardowns/${item.teardownId}${item.section === 'overview' ? '' : `/${item.section}`}`,
        ];
      });
      const name = r.terms.length ? csvFileName('splitcase', 'search', ...r.terms.slice(0, 4)) : csvFileName('splitcase', 'findings');
      res.setHeader('Content-Type', 'text/csv; charset=utf-8');
      res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
      res.setHeader('Cache-Control', 'no-store');
      res.setHeader('X-Total-Count', String(r.hits.length));
      res.status(200).send(toCsv(CSV_HEADER, rows));
    },
  ),
  route(
    {
      method: 'get',
      path: '/api/patterns',
      tag: TAG,
      summary:
        'Pattern counts across devices ("1 of 3 pocket heaters has no temperature sensor"), each with the devices behind it; devices judged on their latest teardown the caller may read (viewers: published)',
      access: 'signed-in',
      response: patternsResponse,
    },
    ({ em, user }) => computePatterns(em, user),
  ),
];
