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

/** What the writer needs of the transaction's mysql2 connection (callback API). */
interface DriverConnection {
  execute(sql: string, values: unknown[], callback: (error: Error | null) => void): void;
  query(sql: string, values: unknown[], callback: (error: Error | null) => void): void;
  unprepare(sql: string): void;
}

/**
 * The most rows one prepared insert carries: the protocol counts placeholders in 16 bits
 * (MariaDB's COM_STMT_PREPARE answers "too many placeholders" past 65,535).
 */
const maxPlaceholders = 65_535;

/**
 * Writes one import's rows inside its transaction with multi-row inserts. Series are merged by
 * (studio, kind, term, region, period); a point on a date the series already has replaces the
 * old one (newer imports win), and the writer counts how many it replaced for the history.
 */
export class ImportWriter {
  private readonly series = new Map<string, SeriesState>();
  private readonly byId = new Map<number, SeriesState>();
  /** Insert statements by row count, each prepared once on the transaction's connection. */
  private readonly statements = new Map<string, string>();
  private connection?: Promise<DriverConnection>;
  private connected?: DriverConnection;
  /** Set while this session's per-row foreign key checks are off (see writeSales). */
  private checksOff?: Promise<void>;
  private areChecksOff = false;

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
    if (this.checksOff) await this.checkForeignKeys();
    if (points.length * 4 > maxPlaceholders) return this.inPieces(points, 4, (piece) => this.writePoints(piece));
    const values: unknown[] = new Array(points.length * 4);
    let at = 0;
    for (const point of points) {
      values[at++] = point.seriesId;
      values[at++] = point.date;
      values[at++] = point.value;
      values[at++] = point.belowOne ? 1 : 0;
      const state = this.byId.get(point.seriesId);
      if (state) state.points++;
    }
    const sql = this.statement(
      'points',
      points.length,
      `(?,${this.studioId},?,?,?,${this.importId})`,
      (rows) => `INSERT INTO series_points (series_id, studio_id, date, value, below_one, import_id) VALUES ${rows}
       ON DUPLICATE KEY UPDATE value = VALUES(value), below_one = VALUES(below_one), import_id = VALUES(import_id)`,
    );
    await this.execute(sql, values);
  }

  /**
   * Sale rows all carry the same two parents, this studio and this import. Rather than have InnoDB
   * look both up and lock them again for each of a million rows (a fifth of the server's work on
   * these inserts, measured), the first batch reads them once under a shared lock, which holds them
   * until the transaction ends exactly as the per-row checks would, and turns the checks off for
   * this session; points, whose series differ, turn them back on (and close does, always).
   */
  async writeSales(sales: readonly SaleRecord[]): Promise<void> {
    if (sales.length === 0) return;
    if (!this.areChecksOff) await (this.checksOff ??= this.lockParents());
    if (sales.length * 7 > maxPlaceholders) return this.inPieces(sales, 7, (piece) => this.writeSales(piece));
    const values: unknown[] = new Array(sales.length * 7);
    let at = 0;
    for (const sale of sales) {
      values[at++] = sale.date;
      // The reader lets through only what fits the columns (shared/csv/csv-limits.ts).
      values[at++] = sale.item;
      values[at++] = sale.sku;
      values[at++] = Math.round(sale.quantity);
      values[at++] = sale.revenueCents;
      values[at++] = sale.channel ?? 'other';
      values[at++] = sale.currency;
    }
    const sql = this.statement(
      'sales',
      sales.length,
      `(${this.studioId},${this.importId},?,?,?,?,?,?,?)`,
      (rows) => `INSERT INTO sales (studio_id, import_id, date, item, sku, quantity, revenue_cents, channel, currency) VALUES ${rows}`,
    );
    await this.execute(sql, values);
  }

  /**
   * Frees the prepared inserts on the server and turns foreign key checks back on, so the pooled
   * connection goes back as it came; call once the pass is over, whether it worked or not.
   */
  async close(): Promise<void> {
    if (!this.connection) return;
    const connection = await this.connection.catch(() => null);
    for (const sql of this.statements.values()) connection?.unprepare(sql);
    this.statements.clear();
    if (this.checksOff) await this.checkForeignKeys();
  }

  private async lockParents(): Promise<void> {
    const studio = await this.trx('studios').where({ id: this.studioId }).forShare().first('id');
    const upload = await this.trx('imports').where({ id: this.importId, studio_id: this.studioId }).forShare().first('id');
    if (!studio || !upload) throw new Error(`Studio ${this.studioId} or import ${this.importId} is gone`);
    await this.query('SET SESSION foreign_key_checks = 0');
    this.areChecksOff = true;
  }

  private async checkForeignKeys(): Promise<void> {
    this.checksOff = undefined;
    this.areChecksOff = false;
    await this.query('SET SESSION foreign_key_checks = 1');
  }

  /**
   * A multi-row insert of `count` rows as one prepared statement. A million rows go through two
   * texts (the full batch and the last one), so the server parses each once and every later batch
   * sends only its values in the binary protocol: no SQL text to build and escape here, none to
   * lex there (measured: about a quarter less server CPU than the same rows as literals).
   */
  private statement(table: string, count: number, row: string, text: (rows: string) => string): string {
    const key = `${table}:${count}`;
    let sql = this.statements.get(key);
    if (sql === undefined) {
      sql = text(new Array<string>(count).fill(row).join(','));
      this.statements.set(key, sql);
    }
    return sql;
  }

  private async inPieces<T>(rows: readonly T[], perRow: number, write: (piece: readonly T[]) => Promise<void>): Promise<void> {
    const most = Math.floor(maxPlaceholders / perRow);
    for (let i = 0; i < rows.length; i += most) await write(rows.slice(i, i + most));
  }

  /**
   * Sends the insert at once when the connection is known: the caller starts a batch and goes on
   * parsing without yielding, so an await before the send would hold the batch back until then.
   */
  private execute(sql: string, values: unknown[]): Promise<void> {
    const send = (connection: DriverConnection) =>
      new Promise<void>((resolve, reject) => connection.execute(sql, values, (error) => (error ? reject(error) : resolve())));
    return this.connected ? send(this.connected) : this.driver().then(send);
  }

  /** A statement on the same connection, in order with the inserts queued there. */
  private async query(sql: string): Promise<void> {
    const connection = await this.driver();
    await new Promise<void>((resolve, reject) => connection.query(sql, [], (error) => (error ? reject(error) : resolve())));
  }

  private async driver(): Promise<DriverConnection> {
    // Knex gives a transaction's client the transaction's one connection; prepared statements
    // are not part of its query builder, so they go to the driver on that connection.
    this.connection ??= this.trx.client.acquireConnection() as Promise<DriverConnection>;
    return (this.connected = await this.connection);
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
