// What the database can hold of an import, in one place: the readers check every cell against
// these sizes, so the preview and the commit refuse the same cells, by row and column, and a cell
// the database would refuse never reaches an INSERT. Sizes from db/migrations (20261201001100_series,
// 20261201001300_sales).
export const importLimits = {
  /** sales.item and series.term (a sales series is named after its item): VARCHAR(200). */
  itemLength: 200,
  /** series.term of search interest: VARCHAR(200). */
  termLength: 200,
  /** series.region: VARCHAR(64). */
  regionLength: 64,
  /** sales.sku: VARCHAR(64). */
  skuLength: 64,
  /**
   * A header cell: a wide file's column name is its series' term, so VARCHAR(200) too; the same
   * bound keeps a runaway header (a whole row of data in one cell) out of every problem message.
   */
  columnNameLength: 200,
  /** sales.quantity INT: signed 32-bit, largest 2^31 − 1 (MariaDB docs, "INT"). */
  quantity: 2_147_483_647,
  /**
   * sales.revenue_cents BIGINT holds up to 2^63 − 1 (MariaDB docs, "BIGINT"), but JavaScript
   * numbers are exact integers only up to 2^53 − 1 (ECMAScript, Number.MAX_SAFE_INTEGER), and the
   * driver hands BIGINT back as numbers: the smaller bound keeps every stored cent exact.
   */
  revenueCents: Number.MAX_SAFE_INTEGER,
  /**
   * Search interest is an index of 0 to 100 (values outside are warned about); past a billion
   * either way no index is meant, and the scores' ratios of such values could overflow a double
   * (a rule of thumb, common practice: a bound far beyond any real index).
   */
  interestValue: 1_000_000_000,
  /** Sales dated before this year are taken for typos (common practice: no studio's books go back further). */
  firstSalesYear: 1990,
} as const;

/**
 * Characters as VARCHAR(n) counts them in utf8mb4: code points (MariaDB docs, "VARCHAR": the length
 * is in characters). A JavaScript string's length counts UTF-16 units, two for an emoji.
 */
export function characterCount(text: string): number {
  let count = text.length;
  for (let at = 0; at < text.length; at++) {
    const code = text.charCodeAt(at);
    // A high surrogate followed by a low one is one character (Unicode §3.8, D75).
    if (code >= 0xd800 && code <= 0xdbff && at + 1 < text.length) {
      const next = text.charCodeAt(at + 1);
      if (next >= 0xdc00 && next <= 0xdfff) {
        count--;
        at++;
      }
    }
  }
  return count;
}

/** Whether text fits a column of `limit` characters; the cheap length test settles most cells. */
export function fitsLength(text: string, limit: number): boolean {
  return text.length <= limit || characterCount(text) <= limit;
}

export interface DateWindow {
  first: string;
  /** Null when the studio's today is not known, so only the start applies. */
  last: string | null;
}

/**
 * The sales dates an import accepts: from 1 January 1990 to one year after the studio's today (a
 * year of slack for orders dated ahead; common practice, a rule of thumb). 29 February has no twin
 * a year on, so 28 February stands in.
 */
export function salesDateWindow(today: string | undefined): DateWindow {
  const first = `${importLimits.firstSalesYear}-01-01`;
  if (today === undefined) return { first, last: null };
  const monthAndDay = today.slice(4) === '-02-29' ? '-02-28' : today.slice(4);
  return { first, last: `${Number(today.slice(0, 4)) + 1}${monthAndDay}` };
}

/** A cell as messages quote it: whole when short, else its start and its length. */
export function quoteCell(text: string, shown = 40): string {
  if (text.length <= shown) return `"${text}"`;
  return `"${Array.from(text.slice(0, shown * 2)).slice(0, shown).join('')}…" (${characterCount(text).toLocaleString('en-US')} characters)`;
}
