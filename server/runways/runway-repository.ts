import type { Knex } from 'knex';
import type { RunwayStep } from '@shared/planning/runway-types';
import type { AnchorKind } from '@shared/contracts/runways';
import { EventRepository, type NewEvent } from '../events/event-repository';

export interface RunwayRow {
  id: number;
  theme_id: number | null;
  theme_name: string | null;
  name: string;
  template: string | null;
  anchor_kind: AnchorKind;
  anchor_value: string | null;
  anchor_date: string;
  offset_days: number;
  launch: string;
  created_at: Date;
}

export interface TemplateRow {
  id: number;
  name: string;
  steps: string;
  version: number;
}

export interface NewRunway {
  themeId: number | null;
  name: string;
  template: string | null;
  anchorKind: AnchorKind;
  anchorValue: string | null;
  anchorDate: string;
  offsetDays: number;
  launch: string;
  createdBy: number;
}

export class RunwayRepository {
  constructor(private readonly db: Knex) {}

  private runways(studioId: number) {
    return this.db('runways as r')
      .leftJoin('themes as t', 't.id', 'r.theme_id')
      .where('r.studio_id', studioId)
      .select('r.id', 'r.theme_id', 't.name as theme_name', 'r.name', 'r.template', 'r.anchor_kind', 'r.anchor_value', 'r.anchor_date', 'r.offset_days', 'r.launch', 'r.created_at');
  }

  list(studioId: number): Promise<RunwayRow[]> {
    return this.runways(studioId).orderBy([{ column: 'r.launch' }, { column: 'r.id' }]);
  }

  find(studioId: number, id: number): Promise<RunwayRow | undefined> {
    return this.runways(studioId).andWhere('r.id', id).first();
  }

  /** The runway and its steps in one transaction: all of it is stored or none. */
  async insert(studioId: number, runway: NewRunway, steps: NewEvent[]): Promise<number> {
    return this.db.transaction(async (trx) => {
      const [id] = await trx('runways').insert({
        studio_id: studioId,
        theme_id: runway.themeId,
        name: runway.name,
        template: runway.template,
        anchor_kind: runway.anchorKind,
        anchor_value: runway.anchorValue,
        anchor_date: runway.anchorDate,
        offset_days: runway.offsetDays,
        launch: runway.launch,
        created_by: runway.createdBy,
      });
      await new EventRepository(trx).insertMany(studioId, steps.map((step) => ({ ...step, runwayId: id })));
      return id as number;
    });
  }

  async delete(studioId: number, id: number): Promise<number> {
    // The steps go with it (events.runway_id cascades), so the events stamp moves on.
    const deleted = await this.db('runways').where({ studio_id: studioId, id }).delete();
    if (deleted > 0) await new EventRepository(this.db).bumpStamp(studioId);
    return deleted;
  }

  theme(studioId: number, id: number): Promise<{ id: number; name: string; target_kind: string | null; target_value: string | null; target_date: string | null; offset_days: number } | undefined> {
    return this.db('themes').where({ studio_id: studioId, id }).first('id', 'name', 'target_kind', 'target_value', 'target_date', 'offset_days');
  }

  templates(studioId: number): Promise<TemplateRow[]> {
    return this.db('runway_templates').where({ studio_id: studioId }).orderBy('id').select('id', 'name', 'steps', 'version');
  }

  template(studioId: number, id: number): Promise<TemplateRow | undefined> {
    return this.db('runway_templates').where({ studio_id: studioId, id }).first('id', 'name', 'steps', 'version');
  }

  async insertTemplate(studioId: number, name: string, steps: RunwayStep[]): Promise<number> {
    const [id] = await this.db('runway_templates').insert({ studio_id: studioId, name, steps: JSON.stringify(steps) });
    return id;
  }

  updateTemplate(studioId: number, id: number, name: string, steps: RunwayStep[], version: number | undefined): Promise<number> {
    const query = this.db('runway_templates').where({ studio_id: studioId, id });
    if (version !== undefined) query.andWhere({ version });
    return query.update({ name, steps: JSON.stringify(steps), version: this.db.raw('version + 1'), updated_at: this.db.fn.now() });
  }

  deleteTemplate(studioId: number, id: number): Promise<number> {
    return this.db('runway_templates').where({ studio_id: studioId, id }).delete();
  }
}
