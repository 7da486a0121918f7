// The FTS5 side of the search: turning the words a user typed into a MATCH expression that can
// never be read as query syntax, and the ranking weights of the columns.
import { SNIPPET_HIT_END, SNIPPET_HIT_START } from '@splitcase/contracts';

/**
 * A MATCH expression for these words: each word (letters, digits and marks only, from contracts'
 * searchTerms) becomes a quoted prefix term, and the terms are ANDed. Quoted, a word such as NEAR,
 * AND, OR or NOT is a plain word; a word has no quote to escape, and `"` is doubled anyway.
 */
export function ftsMatch(terms: string[]): string {
  if (terms.length === 0) throw new Error('ftsMatch needs at least one word');
  return terms.map((t) => `"${t.replaceAll('"', '""')}"*`).join(' ');
}

/**
 * bm25 weights of the indexed columns, in table order: title (part description, device name), body
 * (finding text, summary, comment, part notes), detail (designators, marking, maker part number,
 * package, category; safety notes), tags. A hit in a title or a tag says more than one in running
 * text; the short codes of the detail column say less.
 */
export const BM25 = 'bm25(search_fts, 3.0, 1.0, 0.5, 2.0)';

/**
 * The explorer is about findings: at equal text relevance a finding comes before a teardown
 * summary, a part and a comment. This also offsets bm25's length normalisation, which one table of
 * mixed records skews: hundreds of parts with short notes make the average body short, so the long
 * text of a finding would otherwise lose to a part whose category or marking carries the word.
 * Multiplies the bm25 score (negative: lower is better).
 */
export const TYPE_BOOST = { finding: 2.0, teardown: 1.5, part: 1.0, comment: 0.8 } as const;

/** Up to 24 tokens around the best hit, hits between the markers the web app renders as highlights. */
export const SNIPPET = `snippet(search_fts, -1, '${SNIPPET_HIT_START}', '${SNIPPET_HIT_END}', '…', 24)`;
