import type { CsvPreview, CsvProblem, SaleRecord, SalesMapping } from './csv-types';
import type { RowReader } from './interest-reader';
import { createProblem } from './csv-problem';
import { defaultChannels, matchChannel } from './csv-channels';
import { toCents } from './csv-numbers';
import { importLimits, quoteCell, salesDateWindow } from './csv-limits';
import { RowContext, type ReaderOptions } from './row-context';

export interface SalesSummary {
  kind: 'sales';
  /** Data rows read (blank lines and preamble not counted). */
  rows: number;
  /** Sale records produced. */
  records: number;
  /** Records with a negative quantity or revenue. */
  refunds: number;
  /** Records with a negative quantity: returns, stored as negative sales. */
  returns: number;
  revenueCents: number;
  start: string | null;
  end: string | null;
  /** Channel cells that matched none of the studio's channels, stored as 'other'. */
  unknownChannels: { value: string; count: number; firstRow: number }[];
  problems: CsvProblem[];
  problemCount: number;
  hasErrors: boolean;
}

export type SalesPreview = Pick<CsvPreview, 'headerRow' | 'columns' | 'dateFormat' | 'decimalSeparator' | 'mapping'>;

const currencyCode = /^[A-Za-z]{3}$/;

export function createSalesReader(
  preview: SalesPreview,
  options: ReaderOptions = {},
): RowReader<SaleRecord, SalesSummary> {
  const context = new RowContext(preview, options);
  const mapping = preview.mapping as SalesMapping;
  const channels = options.channels ?? defaultChannels;
  const matchedChannels = new Map<string, string | null>();
  const unknownChannels = new Map<string, { value: string; count: number; firstRow: number }>();
  const totals = { records: 0, refunds: 0, returns: 0, revenueCents: 0, start: null as string | null, end: null as string | null };

  const readChannel = (cells: readonly string[], rowNumber: number): string | null => {
    if (mapping.channel === undefined) return null;
    const text = context.readText(cells, mapping.channel, rowNumber);
    // Channel cells repeat a handful of spellings, so each is matched once.
    let channel = matchedChannels.get(text);
    if (channel === undefined) {
      channel = matchChannel(text, channels);
      if (matchedChannels.size < 1000) matchedChannels.set(text, channel);
    }
    if (channel === 'other' && !channels.includes('other')) {
      const seen = unknownChannels.get(text.toLowerCase());
      if (seen) seen.count++;
      else {
        unknownChannels.set(text.toLowerCase(), { value: text, count: 1, firstRow: rowNumber });
        const message = `Channel ${quoteCell(text)} is not one of the studio's channels (${channels.join(', ')}); it is stored as "other"`;
        context.problems.add(createProblem('unknown-channel', rowNumber, mapping.channel, message, 'warning'));
      }
    }
    return channel;
  };

  const reportMissing = (rowNumber: number, column: string, what: string) => {
    const message = `Row ${rowNumber} has no ${what} in column "${column}"`;
    context.problems.add(createProblem('missing-value', rowNumber, column, message));
  };

  const readCurrency = (cells: readonly string[], rowNumber: number, fromSign: string | null) => {
    const text = context.readText(cells, mapping.currency, rowNumber).toUpperCase();
    if (text !== '' && !currencyCode.test(text)) {
      const message = `${quoteCell(text)} in column "${mapping.currency}" is not a three-letter currency code`;
      context.problems.add(createProblem('not-a-number', rowNumber, mapping.currency ?? null, message, 'warning'));
      return fromSign ?? options.defaultCurrency ?? null;
    }
    return text || fromSign || options.defaultCurrency || null;
  };

  const window = salesDateWindow(options.today);
  const readSaleDate = (cells: readonly string[], rowNumber: number): string | null => {
    const date = context.readDate(cells, mapping.date, rowNumber);
    if (date === null || (date >= window.first && (window.last === null || date <= window.last))) return date;
    const range = window.last === null ? `${window.first} on` : `${window.first} to ${window.last}`;
    context.reportRange(context.cell(cells, mapping.date), mapping.date, rowNumber, `sales dates run from ${range}; one outside is usually a typo`);
    return null;
  };
  const readItem = (cells: readonly string[], rowNumber: number): string | null => {
    const item = context.requireText(cells, mapping.item, rowNumber, 'item');
    return item !== null && context.fits(item, mapping.item, rowNumber, importLimits.itemLength) ? item : null;
  };
  const readSku = (cells: readonly string[], rowNumber: number): string | null | undefined => {
    if (mapping.sku === undefined) return null;
    const sku = context.readText(cells, mapping.sku, rowNumber);
    return context.fits(sku, mapping.sku, rowNumber, importLimits.skuLength) ? sku || null : undefined;
  };
  // Whole units, as the INT column stores them (the writer rounds), within its range.
  const readQuantity = (cells: readonly string[], rowNumber: number): number | null => {
    const quantity = context.readNumber(cells, mapping.quantity, rowNumber);
    if (quantity.kind === 'blank') reportMissing(rowNumber, mapping.quantity, 'quantity');
    if (quantity.kind !== 'number') return null;
    if (Math.abs(Math.round(quantity.value)) <= importLimits.quantity) return quantity.value;
    const limit = importLimits.quantity.toLocaleString('en-US');
    context.reportRange(context.cell(cells, mapping.quantity), mapping.quantity, rowNumber, `a quantity is at most ${limit} units either way`);
    return null;
  };
  const readRevenue = (cells: readonly string[], rowNumber: number): { cents: number; currency: string | null } | null => {
    const revenue = context.readNumber(cells, mapping.revenue, rowNumber);
    if (revenue.kind === 'blank') reportMissing(rowNumber, mapping.revenue, 'revenue');
    if (revenue.kind !== 'number') return null;
    const cents = toCents(revenue.value);
    if (Math.abs(cents) <= importLimits.revenueCents) return { cents, currency: revenue.currency };
    const limit = (importLimits.revenueCents / 100).toLocaleString('en-US', { maximumFractionDigits: 2 });
    context.reportRange(context.cell(cells, mapping.revenue), mapping.revenue, rowNumber, `revenue is at most ${limit} either way`);
    return null;
  };

  return {
    push(cells, rowNumber) {
      if (!context.accepts(cells, rowNumber)) return [];
      const date = readSaleDate(cells, rowNumber);
      const item = readItem(cells, rowNumber);
      const sku = readSku(cells, rowNumber);
      const quantity = readQuantity(cells, rowNumber);
      const revenue = readRevenue(cells, rowNumber);
      const channel = readChannel(cells, rowNumber);
      if (date === null || item === null || sku === undefined || quantity === null || revenue === null) return [];
      const sale: SaleRecord = {
        date,
        item,
        sku,
        quantity,
        revenueCents: revenue.cents,
        channel,
        currency: readCurrency(cells, rowNumber, revenue.currency),
      };
      totals.records++;
      if (sale.quantity < 0) totals.returns++;
      if (sale.quantity < 0 || sale.revenueCents < 0) totals.refunds++;
      totals.revenueCents += sale.revenueCents;
      if (totals.start === null || date < totals.start) totals.start = date;
      if (totals.end === null || date > totals.end) totals.end = date;
      return [sale];
    },
    finish() {
      return {
        kind: 'sales',
        rows: context.rows,
        ...totals,
        unknownChannels: [...unknownChannels.values()],
        problems: context.problems.list(),
        problemCount: context.problems.count,
        hasErrors: context.problems.hasErrors,
      };
    },
  };
}
