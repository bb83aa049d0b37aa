import type { Knex } from 'knex';
import type { SeriesDetail, SeriesListQuery, SeriesPage, SeriesSummary, TargetChoices } from '@shared/contracts/series';
import { notFound } from '../http/app-error';
import type { StudioContext } from '../http/auth-middleware';
import { analyseSeries } from './series-analysis';
import { SeriesRepository, type ListedRow } from './series-repository';
import type { ScoringService } from './scoring-service';
import { targetChoices } from './targets';

function toSummary(row: ListedRow): SeriesSummary {
  return {
    id: row.id,
    term: row.term,
    region: row.region,
    kind: row.kind,
    period: row.period,
    start: row.start_date,
    end: row.end_date,
    points: row.points,
    score: row.score_json ? JSON.parse(row.score_json) : null,
    spark: row.spark_json ? JSON.parse(row.spark_json) : null,
    scoredFor: row.scored_for ?? null,
  };
}

export class SeriesService {
  private readonly series: SeriesRepository;

  constructor(
    db: Knex,
    private readonly scoring: ScoringService,
  ) {
    this.series = new SeriesRepository(db);
  }

  async list(studio: StudioContext, query: SeriesListQuery): Promise<SeriesPage> {
    const context = await this.scoring.context(studio.id);
    const targetKey = query.target ?? '';
    const target = await this.scoring.ensureFresh(studio.id, targetKey, context);
    const page = query.page ?? 1;
    const pageSize = query.pageSize ?? 25;
    const sort = query.sort ?? 'heat';
    const order = query.order ?? (sort === 'term' || sort === 'nextPeak' ? 'asc' : 'desc');
    const { rows, total } = await this.series.page(studio.id, targetKey, { ...query, sort, order, page, pageSize });
    return { items: rows.map(toSummary), total, page, pageSize, target, today: context.today };
  }

  async detail(studio: StudioContext, seriesId: number, targetKey = ''): Promise<SeriesDetail> {
    const [row] = await this.series.rows(studio.id, [seriesId]);
    if (!row) throw notFound('Series');
    const context = await this.scoring.context(studio.id);
    const target = await this.scoring.ensureFresh(studio.id, targetKey, context, [seriesId]);
    const stored = (await this.series.scoresFor(studio.id, targetKey, [seriesId])).get(seriesId);
    const points = (await this.series.pointsOf(studio.id, [seriesId])).get(seriesId) ?? [];
    const reading = (await this.scoring.readings(studio.id, [row])).get(seriesId);
    return {
      ...toSummary({ ...row, ...stored }),
      values: points,
      analysis: analyseSeries(points, row.period, reading),
      target,
      today: context.today,
    };
  }

  async targets(studio: StudioContext): Promise<TargetChoices> {
    const context = await this.scoring.context(studio.id);
    return targetChoices(context.place, context.today);
  }
}
