import type { Knex } from 'knex';
import { DEFAULT_TEMPLATE_ID, type RunwayTemplateView } from '@shared/contracts/runways';
import { DEFAULT_DECOR_TEMPLATE } from '@shared/planning/default-template';
import type { RunwayTemplateInput } from '@shared/planning/schemas';
import { AppError, notFound } from '../http/app-error';
import type { StudioContext } from '../http/auth-middleware';
import { RunwayRepository, type TemplateRow } from './runway-repository';

// The built-in template is code, not a row: every studio sees it as id "default", read-only, and
// a fix to its cautions reaches every studio at once. Studios copy it to make their own.
export const BUILT_IN_TEMPLATE: RunwayTemplateView = {
  id: DEFAULT_TEMPLATE_ID,
  name: DEFAULT_DECOR_TEMPLATE.name,
  isBuiltIn: true,
  steps: DEFAULT_DECOR_TEMPLATE.steps.map((step) => ({ ...step, cautions: [...(step.cautions ?? [])] })),
  version: 1,
};

function toView(row: TemplateRow): RunwayTemplateView {
  return { id: row.id, name: row.name, isBuiltIn: false, steps: JSON.parse(row.steps), version: row.version };
}

/** "default" or a positive whole number, as it comes in a path. */
export function templateIdParam(raw: string): number | typeof DEFAULT_TEMPLATE_ID {
  if (raw === DEFAULT_TEMPLATE_ID) return raw;
  const id = Number(raw);
  if (!Number.isInteger(id) || id <= 0) throw notFound(`Template ${raw}`);
  return id;
}

export class TemplateService {
  private readonly repository: RunwayRepository;

  constructor(db: Knex) {
    this.repository = new RunwayRepository(db);
  }

  async list(studio: StudioContext): Promise<RunwayTemplateView[]> {
    return [BUILT_IN_TEMPLATE, ...(await this.repository.templates(studio.id)).map(toView)];
  }

  async get(studio: StudioContext, id: number | typeof DEFAULT_TEMPLATE_ID): Promise<RunwayTemplateView> {
    if (id === DEFAULT_TEMPLATE_ID) return BUILT_IN_TEMPLATE;
    const row = await this.repository.template(studio.id, id);
    if (!row) throw notFound(`Template ${id}`);
    return toView(row);
  }

  async create(studio: StudioContext, template: RunwayTemplateInput): Promise<RunwayTemplateView> {
    return this.get(studio, await this.repository.insertTemplate(studio.id, template.name, template.steps));
  }

  async update(studio: StudioContext, id: number | typeof DEFAULT_TEMPLATE_ID, template: RunwayTemplateInput & { version?: number }): Promise<RunwayTemplateView> {
    if (id === DEFAULT_TEMPLATE_ID) throw builtIn();
    const changed = await this.repository.updateTemplate(studio.id, id, template.name, template.steps, template.version);
    if (changed === 0) {
      const current = await this.repository.template(studio.id, id);
      if (!current) throw notFound(`Template ${id}`);
      throw new AppError('version_conflict', 409, 'Someone else changed this template; reload and try again', undefined, { current: toView(current) });
    }
    return this.get(studio, id);
  }

  async remove(studio: StudioContext, id: number | typeof DEFAULT_TEMPLATE_ID): Promise<void> {
    if (id === DEFAULT_TEMPLATE_ID) throw builtIn();
    if ((await this.repository.deleteTemplate(studio.id, id)) === 0) throw notFound(`Template ${id}`);
  }
}

function builtIn(): AppError {
  return new AppError('built_in', 400, 'The built-in template cannot be changed; save a copy as a template of your own');
}
