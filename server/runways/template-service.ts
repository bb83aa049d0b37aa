import type { Knex } from 'knex';
import type { RunwayTemplateView, TemplateId } from '@shared/contracts/runways';
import { BUILT_IN_TEMPLATE_IDS, BUILT_IN_TEMPLATES, isBuiltInTemplateId, type BuiltInTemplateId } from '@shared/planning/built-in-templates';
import type { RunwayTemplateInput } from '@shared/planning/schemas';
import { AppError, notFound } from '../http/app-error';
import type { StudioContext } from '../http/auth-middleware';
import { RunwayRepository, type TemplateRow } from './runway-repository';

// The built-in templates are code, not rows: every studio sees them under their string ids,
// read-only, and a fix to their cautions reaches every studio at once. Studios copy them to edit.
function builtInView(id: BuiltInTemplateId): RunwayTemplateView {
  const template = BUILT_IN_TEMPLATES[id];
  return { id, name: template.name, isBuiltIn: true, steps: template.steps.map((step) => ({ ...step, cautions: [...(step.cautions ?? [])] })), version: 1 };
}

const BUILT_IN_TEMPLATE_VIEWS: readonly RunwayTemplateView[] = BUILT_IN_TEMPLATE_IDS.map(builtInView);

function toView(row: TemplateRow): RunwayTemplateView {
  return { id: row.id, name: row.name, isBuiltIn: false, steps: JSON.parse(row.steps), version: row.version };
}

/** A built-in template's id or a positive whole number, as it comes in a path. */
export function templateIdParam(raw: string): TemplateId {
  if (isBuiltInTemplateId(raw)) return raw;
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
    return [...BUILT_IN_TEMPLATE_VIEWS, ...(await this.repository.templates(studio.id)).map(toView)];
  }

  async get(studio: StudioContext, id: TemplateId): Promise<RunwayTemplateView> {
    if (isBuiltInTemplateId(id)) return builtInView(id);
    const row = await this.repository.template(studio.id, id);
    if (!row) throw notFound(`Template ${id}`);
    return toView(row);
  }

  async create(studio: StudioContext, template: RunwayTemplateInput): Promise<RunwayTemplateView> {
    return this.get(studio, await this.repository.insertTemplate(studio.id, template.name, template.steps));
  }

  async update(studio: StudioContext, id: TemplateId, template: RunwayTemplateInput & { version?: number }): Promise<RunwayTemplateView> {
    if (isBuiltInTemplateId(id)) throw builtIn(id);
    const changed = await this.repository.updateTemplate(studio.id, id, template.name, template.steps, template.version);
    if (changed === 0) {
      const current = await this.repository.template(studio.id, id);
      if (!current) throw notFound(`Template ${id}`);
      throw new AppError('version_conflict', 409, 'Someone else changed this template; reload and try again', undefined, { current: toView(current) });
    }
    return this.get(studio, id);
  }

  async remove(studio: StudioContext, id: TemplateId): Promise<void> {
    if (isBuiltInTemplateId(id)) throw builtIn(id);
    if ((await this.repository.deleteTemplate(studio.id, id)) === 0) throw notFound(`Template ${id}`);
  }
}

function builtIn(id: BuiltInTemplateId): AppError {
  return new AppError('built_in', 400, `"${BUILT_IN_TEMPLATES[id].name}" is built in and cannot be changed; save a copy as a template of your own`);
}
