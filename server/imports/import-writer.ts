import type { Knex } from 'knex';
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

function tuples(count: number, width: number): string {
  const one = `(${new Array(width).fill('?').join(',')})`;
  return new Array(count).fill(one).join(',');
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
    const bindings: Knex.Value[] = [];
    for (const point of points) {
      bindings.push(point.seriesId, this.studioId, point.date, point.value, point.belowOne ? 1 : 0, this.importId);
      const state = this.byId.get(point.seriesId);
      if (state) state.points++;
    }
    await this.trx.raw(
      `INSERT INTO series_points ${pointColumns} VALUES ${tuples(points.length, 6)}
       ON DUPLICATE KEY UPDATE value = VALUES(value), below_one = VALUES(below_one), import_id = VALUES(import_id)`,
      bindings,
    );
  }

  async writeSales(sales: readonly SaleRecord[]): Promise<void> {
    if (sales.length === 0) return;
    const bindings: Knex.Value[] = [];
    for (const sale of sales) {
      bindings.push(
        this.studioId, this.importId, sale.date, sale.item.slice(0, 200), sale.sku?.slice(0, 64) ?? null,
        Math.round(sale.quantity), sale.revenueCents, sale.channel ?? 'other', sale.currency,
      );
    }
    await this.trx.raw(`INSERT INTO sales ${saleColumns} VALUES ${tuples(sales.length, 9)}`, bindings);
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
