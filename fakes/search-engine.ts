// The in-memory index behind the search fake. Words are cut and folded by MiniSearch's own tokenizer
// and kept in its radix tree (SearchableMap) for exact, prefix and typo lookups; ranking follows the
// hosted service's documented default rules, in their order:
//   words      all query words first; when too few documents match them all, the last words are
//              dropped one at a time (its default "last" matching strategy);
//   typo       fewer typos first (1 allowed from 5 letters, 2 from 9, its default sizes; a swap of
//              two neighbouring letters counts as one typo, as the service counts it — from memory);
//   attribute  a word in an earlier searchable attribute first;
//   exactness  whole words before prefixes (only the last query word is read as a prefix).
// Proximity is left out. Each query touches only the postings of the words it matches, and every
// ranking key is a small integer, so a query over 50,000 documents costs a few milliseconds.
import MiniSearch from "minisearch";
import SearchableMap from "minisearch/SearchableMap";

export type Doc = Record<string, unknown> & { id: string };

const tokenize = MiniSearch.getDefault("tokenize") as (text: string) => string[];
const processTerm = MiniSearch.getDefault("processTerm") as (term: string) => string | null | undefined | false;
/** The service reads at most ten words of a query. */
const MAX_QUERY_WORDS = 10;
const NOT_MATCHED = 255;

export const typoBudget = (word: string) => (word.length >= 9 ? 2 : word.length >= 5 ? 1 : 0);

export const words = (text: string) =>
  tokenize(text)
    .map((t) => processTerm(t))
    .filter((t): t is string => typeof t === "string" && t.length > 0);

/** The word with each pair of neighbouring letters swapped. */
function swaps(word: string) {
  const out = new Set<string>();
  for (let i = 0; i + 1 < word.length; i++) {
    if (word[i] !== word[i + 1]) out.add(word.slice(0, i) + word[i + 1] + word[i] + word.slice(i + 2));
  }
  out.delete(word);
  return out;
}

interface Postings {
  /** Document numbers, ascending, each once. */
  docs: number[];
  /** For each entry of `docs`, the earliest searchable attribute holding the word. */
  attr: number[];
}

/** A document value as text: strings, numbers and booleans as written, anything else as JSON. */
export const scalarText = (v: unknown) =>
  typeof v === "string" ? v : typeof v === "number" || typeof v === "boolean" ? String(v) : JSON.stringify(v);
const fieldText = (v: unknown) => (Array.isArray(v) ? v.map(scalarText).join(" ") : v == null ? "" : scalarText(v));

export class SearchEngine {
  private readonly docs: Doc[];
  private readonly terms = new SearchableMap<Postings>();

  constructor(docs: Iterable<Doc>, fields: string[]) {
    this.docs = [...docs];
    this.docs.forEach((doc, n) => {
      fields.forEach((field, attr) => {
        for (const word of words(fieldText(doc[field]))) {
          const p = this.terms.fetch(word, () => ({ docs: [], attr: [] }));
          const last = p.docs.length - 1;
          if (p.docs[last] === n) p.attr[last] = Math.min(p.attr[last]!, attr);
          else {
            p.docs.push(n);
            p.attr.push(attr);
          }
        }
      });
    });
  }

  get size() {
    return this.docs.length;
  }

  /**
   * The documents for `q`, best first, among those `allowed` admits; `wanted` is offset + limit,
   * which decides whether fewer-word buckets are needed. Returns every ranked hit (facets count
   * them all).
   */
  search(q: string, allowed: (doc: Doc) => boolean, wanted: number): Doc[] {
    const query = words(q).slice(0, MAX_QUERY_WORDS);
    const n = this.docs.length;
    if (query.length === 0) return this.docs.filter(allowed);

    // Per query word: its fewest typos and best attribute in each document, plus prefix-only marks.
    const typos: Uint8Array[] = [];
    const attrs: Uint8Array[] = [];
    const prefixOnly: Uint8Array[] = [];
    query.forEach((word, j) => {
      const typo = new Uint8Array(n).fill(NOT_MATCHED);
      const attr = new Uint8Array(n).fill(NOT_MATCHED);
      const prefix = new Uint8Array(n);
      const take = (p: Postings, distance: number, isPrefix: boolean) => {
        for (let k = 0; k < p.docs.length; k++) {
          const d = p.docs[k]!;
          const a = p.attr[k]!;
          const rank = isPrefix ? 1 : 0;
          const better =
            distance < typo[d]! ||
            (distance === typo[d] && (rank < prefix[d]! || (rank === prefix[d] && a < attr[d]!)));
          if (better) {
            typo[d] = distance;
            attr[d] = a;
            prefix[d] = rank;
          }
        }
      };
      const exact = this.terms.get(word);
      if (exact) take(exact, 0, false);
      if (j === query.length - 1) {
        for (const [term, p] of this.terms.atPrefix(word)) if (term !== word) take(p, 0, true);
      }
      const budget = typoBudget(word);
      if (budget > 0) {
        for (const [term, [p, distance]] of this.terms.fuzzyGet(word, budget))
          if (term !== word && distance > 0) take(p, distance, false);
        for (const swapped of swaps(word)) {
          const p = this.terms.get(swapped);
          if (p) take(p, 1, false);
        }
      }
      typos.push(typo);
      attrs.push(attr);
      prefixOnly.push(prefix);
    });

    // How many leading query words each document holds, and its ranking key within that bucket.
    const leading = new Uint8Array(n);
    const key = new Uint32Array(n);
    const bucketSizes = new Array<number>(query.length + 1).fill(0);
    for (let d = 0; d < n; d++) {
      let k = 0;
      let typoSum = 0;
      let bestAttr = NOT_MATCHED;
      let prefixes = 0;
      while (k < query.length && typos[k]![d] !== NOT_MATCHED) {
        typoSum += typos[k]![d]!;
        bestAttr = Math.min(bestAttr, attrs[k]![d]!);
        prefixes += prefixOnly[k]![d]!;
        k++;
      }
      if (k === 0 || !allowed(this.docs[d]!)) continue;
      leading[d] = k;
      bucketSizes[k]!++;
      key[d] = (query.length - k) * 1_000_000 + typoSum * 10_000 + bestAttr * 100 + prefixes;
    }

    // The "last" strategy: the all-words bucket, then fewer words only while short of `wanted`.
    let minWords = query.length;
    let taken = bucketSizes[minWords]!;
    while (taken < wanted && minWords > 1) taken += bucketSizes[--minWords]!;
    const ranked = new Float64Array(taken);
    let i = 0;
    for (let d = 0; d < n; d++) if (leading[d]! >= minWords) ranked[i++] = key[d]! * 2 ** 24 + d;
    ranked.sort();
    return Array.from(ranked, (v) => this.docs[v % 2 ** 24]!);
  }
}
