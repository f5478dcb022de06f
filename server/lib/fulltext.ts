// Turning what a reader types into a MariaDB FULLTEXT query in BOOLEAN MODE. The reader's
// text never reaches the server's boolean syntax: only words survive, each required (+) and
// matched as a prefix (*), so "washed rind" finds notes about a washed-rind tomme.

// InnoDB's built-in stopword list (information_schema.INNODB_FT_DEFAULT_STOPWORD): a required
// stopword matches no row at all, so they are dropped rather than required.
const INNODB_STOPWORDS = new Set([
  'a',
  'about',
  'an',
  'are',
  'as',
  'at',
  'be',
  'by',
  'com',
  'de',
  'en',
  'for',
  'from',
  'how',
  'i',
  'in',
  'is',
  'it',
  'la',
  'of',
  'on',
  'or',
  'that',
  'the',
  'this',
  'to',
  'was',
  'what',
  'when',
  'where',
  'who',
  'will',
  'with',
  'und',
  'www',
]);

/** Shortest word InnoDB indexes (innodb_ft_min_token_size, default 3). */
const MIN_TOKEN = 3;
/** Longest word InnoDB indexes (innodb_ft_max_token_size, default 84). */
const MAX_TOKEN = 84;
const MAX_TERMS = 8;

/**
 * Returns a safe BOOLEAN MODE query ("+washed* +rind*") from free text, or null when no word
 * in it can match (only short words or stopwords).
 */
export function toBooleanQuery(text: string): string | null {
  const words = text.toLowerCase().match(/[\p{L}\p{N}]+/gu) ?? [];
  const terms: string[] = [];
  for (const word of words) {
    if (word.length < MIN_TOKEN || INNODB_STOPWORDS.has(word)) continue;
    const term = word.slice(0, MAX_TOKEN);
    if (!terms.includes(term)) terms.push(term);
    if (terms.length === MAX_TERMS) break;
  }
  return terms.length ? terms.map((t) => `+${t}*`).join(' ') : null;
}
