import { analyseCsv } from './analyse-csv';
import { readCsvText } from './read-csv-text';
import { longMonthly, salesComma, salesSemicolon, tabDaily, wideWeekly } from '../../tests/fixtures/csv/csv-fixtures';
import type { InterestPoint, SaleRecord } from './csv-types';

const errors = (problems: { severity: string }[]) => problems.filter((problem) => problem.severity === 'error');

describe('analyseCsv: wide search interest', () => {
  const preview = analyseCsv(wideWeekly);

  it('skips the preamble and finds the header after the blank line', () => {
    expect(preview.headerRow).toBe(4);
    expect(preview).toMatchObject({ kind: 'interest', layout: 'wide', delimiter: ',', period: 'weekly' });
    expect(preview.dateFormat).toBe('YYYY-MM-DD');
    expect(preview.rows).toBe(4);
    expect(preview.sample[1]).toEqual(['2024-09-08', '44', '<1', '8']);
    expect(errors(preview.problems)).toEqual([]);
  });

  it('strips the byte-order mark and splits "term: (Region)" header cells', () => {
    expect(preview.columns[0]).toEqual({ index: 0, name: 'Week', role: 'date' });
    expect(preview.columns[1]).toEqual({
      index: 1, name: 'herb planter box: (US)', role: 'series', term: 'herb planter box', region: 'US',
    });
    expect(preview.columns[3]).toEqual({ index: 3, name: 'pumpkin porch sign', role: 'series', term: 'pumpkin porch sign' });
    expect(preview.mapping).toEqual({
      date: 'Week',
      terms: ['herb planter box: (US)', 'lantern panel: (US)', 'pumpkin porch sign'],
    });
  });

  it('reads "<1" as 0.5 flagged below one, and a blank as missing', () => {
    const result = readCsvText(wideWeekly);
    const points = result.records as InterestPoint[];
    expect(points).toHaveLength(12);
    expect(points).toContainEqual({ term: 'lantern panel', region: 'US', date: '2024-09-08', value: 0.5, belowOne: true });
    expect(points).toContainEqual({ term: 'pumpkin porch sign', region: null, date: '2024-09-15', value: null, belowOne: false });
    expect(result.summary).toMatchObject({ kind: 'interest', rows: 4, period: 'weekly', hasErrors: false });
  });

  it('reads tab-separated daily files', () => {
    const tab = analyseCsv(tabDaily);
    expect(tab).toMatchObject({ delimiter: '\t', period: 'daily', layout: 'wide', headerRow: 1 });
  });

  it('honours a mapping that leaves a term out', () => {
    const mapped = analyseCsv(wideWeekly, { mapping: { date: 'Week', terms: ['pumpkin porch sign'] } });
    expect(mapped.columns.map((column) => column.role)).toEqual(['date', 'ignored', 'ignored', 'series']);
  });
});

describe('analyseCsv: long search interest', () => {
  it('detects date, term, value and region columns and a monthly period', () => {
    const preview = analyseCsv(longMonthly);
    expect(preview).toMatchObject({ kind: 'interest', layout: 'long', period: 'monthly', dateFormat: 'YYYY-MM', headerRow: 1 });
    expect(preview.mapping).toEqual({ date: 'month', term: 'term', value: 'interest', region: 'region' });
    expect(errors(preview.problems)).toEqual([]);
  });

  it('makes one series per term and region, months as their first day', () => {
    const result = readCsvText(longMonthly);
    expect(result.records[0]).toEqual({ term: 'herb planter box', region: 'north', date: '2024-01-01', value: 35, belowOne: false });
    if (result.kind !== 'interest') throw new Error('expected interest');
    expect(result.summary.series.map((series) => [series.term, series.points, series.start, series.end])).toEqual([
      ['herb planter box', 3, '2024-01-01', '2024-03-01'],
      ['lantern panel', 3, '2024-01-01', '2024-03-01'],
    ]);
  });
});

describe('analyseCsv: sales', () => {
  it('detects the sales columns from header synonyms', () => {
    const preview = analyseCsv(salesComma);
    expect(preview).toMatchObject({ kind: 'sales', layout: 'sales', period: 'daily', dateFormat: 'M/D/YYYY', dateAmbiguous: false });
    expect(preview.mapping).toEqual({
      date: 'Sale date', item: 'Item', sku: 'SKU', quantity: 'Qty', revenue: 'Revenue', channel: 'Channel', currency: 'Currency',
    });
  });

  it('keeps quoted commas and doubled quotes, reads currency signs, refunds and channels', () => {
    const result = readCsvText(salesComma, { defaultCurrency: 'USD' });
    const sales = result.records as SaleRecord[];
    expect(sales[0]).toEqual({
      date: '2025-03-14', item: 'Lantern panel, walnut', sku: 'LP-WAL', quantity: 2, revenueCents: 124000, channel: 'market', currency: 'USD',
    });
    expect(sales[1]).toMatchObject({ item: 'The "Big" herb planter', revenueCents: 3850, channel: 'booth' });
    expect(sales[2]).toMatchObject({ quantity: -1, revenueCents: -2400, channel: 'online' });
    // "Craft fair" is a known other word for a market; "pop-up tent" is not one of the channels.
    expect(sales[3].channel).toBe('market');
    expect(sales[4].channel).toBe('other');
    if (result.kind !== 'sales') throw new Error('expected sales');
    expect(result.summary).toMatchObject({ records: 5, refunds: 1, revenueCents: 124000 + 3850 - 2400 + 7200 + 1999 });
    expect(result.summary.unknownChannels).toEqual([{ value: 'pop-up tent', count: 1, firstRow: 6 }]);
    expect(result.summary.problems).toContainEqual(expect.objectContaining({ code: 'unknown-channel', row: 6, column: 'Channel' }));
  });

  it('reads semicolon files with decimal commas, thousands dots and D.M.YYYY dates', () => {
    const result = readCsvText(salesSemicolon);
    expect(result.preview).toMatchObject({ delimiter: ';', decimalSeparator: ',', dateFormat: 'D.M.YYYY' });
    expect(result.preview.mapping).toEqual({ date: 'Datum', item: 'Product', quantity: 'Units', revenue: 'Amount', channel: 'Channel' });
    expect(result.records).toEqual([
      { date: '2025-10-02', item: 'Lantern panel', sku: null, quantity: 2, revenueCents: 123450, channel: 'market', currency: 'EUR' },
      { date: '2025-10-03', item: 'Herb planter box', sku: null, quantity: 1, revenueCents: 3850, channel: 'online', currency: null },
      { date: '2025-10-04', item: 'Herb planter box', sku: null, quantity: -1, revenueCents: -3850, channel: 'online', currency: null },
    ]);
  });

  it('uses the studio’s own channel list', () => {
    const result = readCsvText(salesComma, { channels: ['market', 'booth', 'online', 'pop-up tent'] });
    expect((result.records as SaleRecord[])[4].channel).toBe('pop-up tent');
  });

  it('takes the kind from the user when told', () => {
    const text = 'date,item,score\n2025-01-05,lantern panel,4\n2025-01-12,lantern panel,6';
    expect(analyseCsv(text, { kind: 'interest' }).layout).not.toBe('sales');
  });
});

describe('analyseCsv: dates', () => {
  const ambiguous = 'date,herb planter box\n1/5/2025,10\n2/5/2025,12\n3/5/2025,14';

  it('asks when every slash date reads both ways', () => {
    const preview = analyseCsv(ambiguous);
    expect(preview.dateAmbiguous).toBe(true);
    expect(preview.problems).toContainEqual(expect.objectContaining({ code: 'date-ambiguous', column: 'date', severity: 'warning' }));
  });

  it('resolves the order from dateOrder', () => {
    const dayFirst = readCsvText(ambiguous, { dateOrder: 'DMY' });
    expect(dayFirst.preview).toMatchObject({ dateFormat: 'D/M/YYYY', dateAmbiguous: false, period: 'daily' });
    expect(dayFirst.records.map((point) => point.date)).toEqual(['2025-05-01', '2025-05-02', '2025-05-03']);
    const monthFirst = readCsvText(ambiguous, { dateOrder: 'MDY' });
    expect(monthFirst.preview.period).toBe('monthly');
    expect(monthFirst.records.map((point) => point.date)).toEqual(['2025-01-05', '2025-02-05', '2025-03-05']);
  });

  it('decides day first when a first part is above 12', () => {
    const preview = analyseCsv('date,herb planter box\n6/1/2025,10\n13/1/2025,12\n20/1/2025,14');
    expect(preview).toMatchObject({ dateFormat: 'D/M/YYYY', dateAmbiguous: false, period: 'weekly' });
  });
});

describe('analyseCsv: shapes seen in the wild', () => {
  it('finds the date in a later column of a sales file', () => {
    const preview = analyseCsv('order,date,product,units,total\n1001,2025-06-01,Herb planter box,1,38\n1002,2025-06-01,Lantern panel,2,96');
    expect(preview).toMatchObject({ layout: 'sales', headerRow: 1 });
    expect(preview.mapping).toEqual({ date: 'date', item: 'product', quantity: 'units', revenue: 'total' });
    expect(preview.columns[0].role).toBe('ignored');
  });

  it('drops a last line cut off at the end of a partial read', () => {
    const head = 'Week,lantern panel\n2025-01-05,4\n2025-01-12,5\n2025-01-';
    expect(analyseCsv(head, { isPartial: true })).toMatchObject({ rows: 2, problems: [] });
    expect(analyseCsv(head).problems).toContainEqual(expect.objectContaining({ code: 'unparseable-date', row: 4 }));
  });

  it('reads month-end monthly exports', () => {
    expect(analyseCsv('month,lantern panel\n2024-01-31,4\n2024-02-29,5\n2024-03-31,6').period).toBe('monthly');
  });

  it('gives every column a role, and the sample is the first ten rows', () => {
    const rows = Array.from({ length: 15 }, (_, i) => `2025-01-${String(i + 1).padStart(2, '0')},${i}`);
    const preview = analyseCsv(`Day,lantern panel\n${rows.join('\n')}`);
    expect(preview.sample).toHaveLength(10);
    expect(preview.rows).toBe(15);
  });
});
