import type { Knex } from 'knex';
import { escape } from 'mysql2';
import type { CsvKind, CsvPeriod, SaleRecord } from '@shared/csv';
import { refreshSeries } from './import-repository';

export interface PointRow {
  seriesId: number;
  date: string;
  value: number | null;
  belowOne: boolean;
}

export interface WrittenSeries {
  id: number;
  kind: CsvKind;
  term: string;
  region: string | null;
  period: CsvPeriod;
  points: number;
}

interface SeriesState extends WrittenSeries {
  before: number;
}

const pointColumns = '(series_id, studio_id, date, value, below_one, import_id)';
const saleColumns = '(studio_id, import_id, date, item, sku, quantity, revenue_cents, channel, currency)';

const plainText = /^[^\0\b\t\n\r\x1a"'\\]*$/;

/**
 * One SQL literal. Multi-row inserts of a million rows spend most of their client time in generic
 * binding code (knex's placeholder pass, then the driver's formatting), so rows are written as
 * literals here: numbers as numbers, text quoted, and any text with a quote, backslash or control
 * character escaped by the driver's own escape().
 */
function literal(value: string | number | null): string {
  if (value === null) return 'NULL';
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new Error(`Not a finite number: ${value}`);
    return String(value);
  }
  return plainText.test(value) ? `'${value}'` : escape(value);
}

/**
 * Writes one import's rows inside its transaction with multi-row inserts. Series are merged by
 * (studio, kind, term, region, period); a point on a date the series already has replaces the
 * old one (newer imports win), and the writer counts how many it replaced for the history.
 */
export class ImportWriter {
  private readonly series = new Map<string, SeriesState>();
  private readonly byId = new Map<number, SeriesState>();

  constructor(
    private readonly trx: Knex.Transaction,
    private readonly studioId: number,
    private readonly importId: number,
  ) {}

  /** The id of the series for this key, made when the studio has none yet. */
  async seriesId(kind: CsvKind, term: string, region: string | null, period: CsvPeriod): Promise<number> {
    const key = JSON.stringify([kind, term, region ?? '', period]);
    const known = this.series.get(key);
    if (known) return known.id;
    const [result] = await this.trx.raw(
      `INSERT INTO series (studio_id, kind, term, region, period) VALUES (?, ?, ?, ?, ?)
       ON DUPLICATE KEY UPDATE id = LAST_INSERT_ID(id), updated_at = NOW()`,
      [this.studioId, kind, term, region ?? '', period],
    );
    const id = Number(result.insertId);
    // The unique key ignores case, so two spellings of a term can land on one series.
    let state = this.byId.get(id);
    if (!state) {
      const counted = await this.trx('series_points').where({ series_id: id }).count<{ count: number }[]>({ count: '*' }).first();
      state = { id, kind, term, region, period, points: 0, before: Number(counted?.count ?? 0) };
      this.byId.set(id, state);
    }
    this.series.set(key, state);
    return id;
  }

  async writePoints(points: readonly PointRow[]): Promise<void> {
    if (points.length === 0) return;
    const rows: string[] = [];
    const tail = `${this.studioId},`;
    for (const point of points) {
      rows.push(`(${point.seriesId},${tail}${literal(point.date)},${literal(point.value)},${point.belowOne ? 1 : 0},${this.importId})`);
      const state = this.byId.get(point.seriesId);
      if (state) state.points++;
    }
    await this.trx.raw(
      `INSERT INTO series_points ${pointColumns} VALUES ${rows.join(',')}
       ON DUPLICATE KEY UPDATE value = VALUES(value), below_one = VALUES(below_one), import_id = VALUES(import_id)`,
    );
  }

  async writeSales(sales: readonly SaleRecord[]): Promise<void> {
    if (sales.length === 0) return;
    const head = `(${this.studioId},${this.importId},`;
    const rows: string[] = [];
    for (const sale of sales) {
      rows.push(
        `${head}${literal(sale.date)},${literal(sale.item.slice(0, 200))},${literal(sale.sku?.slice(0, 64) ?? null)},` +
          `${literal(Math.round(sale.quantity))},${literal(sale.revenueCents)},${literal(sale.channel ?? 'other')},${literal(sale.currency)})`,
      );
    }
    await this.trx.raw(`INSERT INTO sales ${saleColumns} VALUES ${rows.join(',')}`);
  }

  /** Records the import history and refreshes each series' start, end and point count. */
  async finish(): Promise<{ series: WrittenSeries[]; replaced: Map<number, number> }> {
    const states = [...this.byId.values()];
    const ids = states.map((state) => state.id);
    const replaced = new Map<number, number>();
    if (ids.length > 0) {
      const counts: { series_id: number; count: number }[] = await this.trx('series_points')
        .whereIn('series_id', ids)
        .groupBy('series_id')
        .select('series_id', this.trx.raw('COUNT(*) AS count'));
      const after = new Map(counts.map((row) => [row.series_id, Number(row.count)]));
      for (const state of states) {
        const added = (after.get(state.id) ?? 0) - state.before;
        replaced.set(state.id, Math.max(0, state.points - added));
      }
      await this.trx('import_series').insert(
        states.map((state) => ({
          import_id: this.importId,
          series_id: state.id,
          studio_id: this.studioId,
          points_written: state.points,
          points_replaced: replaced.get(state.id) ?? 0,
        })),
      );
      await refreshSeries(this.trx, this.studioId, ids);
    }
    return { series: states.map(({ before: _before, ...series }) => series), replaced };
  }
}
