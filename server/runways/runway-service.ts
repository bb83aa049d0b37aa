import type { Knex } from 'knex';
import { addDays, maxDate, minDate } from '@shared/calendar/dates';
import type { PlanWarningView } from '@shared/contracts/calendar';
import { DEFAULT_TEMPLATE_ID, type RunwayCreateBody, type RunwayPreview, type RunwayPreviewBody, type RunwayView } from '@shared/contracts/runways';
import { planRunway, type RunwayPlan, type RunwayStep } from '@shared/planning/runway';
import { bookingsFromEvents } from '@shared/planning/work-calendar';
import { AppError, notFound } from '../http/app-error';
import type { StudioContext } from '../http/auth-middleware';
import { EventRepository, type EventRow } from '../events/event-repository';
import { toPlacedStep } from '../events/event-views';
import { loadStudioCalendar, workCalendarOf, type StudioCalendar } from '../occasions/studio-calendar';
import { resolveAnchor } from './anchor-resolver';
import { RunwayRepository, type RunwayRow } from './runway-repository';
import { TemplateService } from './template-service';
import { ThemesRepository } from '../themes/themes-repository';

// The backward pass may walk three years back from the launch, the too-short check three forward.
const PLAN_REACH_DAYS = 3 * 366 + 30;

interface Planned {
  calendar: StudioCalendar;
  anchorDate: string;
  offsetDays: number;
  themeId?: number;
  steps: RunwayStep[];
  template: string | null;
  templateName: string | null;
  plan: RunwayPlan;
}

function toPreview(planned: Planned): RunwayPreview {
  const { plan } = planned;
  return {
    anchorDate: planned.anchorDate,
    offsetDays: planned.offsetDays,
    launch: plan.launch,
    start: plan.start,
    steps: plan.steps.map(({ name, kind, start, end, workDays, hoursPerDay, cureDays, days, cautions }) => ({ name, kind, start, end, workDays, hoursPerDay, cureDays, days, cautions })),
    warnings: plan.warnings.map((warning) => ({ ...warning }) as PlanWarningView),
  };
}

function toView(row: RunwayRow, steps: EventRow[]): RunwayView {
  return {
    id: row.id,
    name: row.name,
    themeId: row.theme_id,
    themeName: row.theme_name,
    template: row.template,
    anchor: { kind: row.anchor_kind, value: row.anchor_value },
    anchorDate: row.anchor_date,
    offsetDays: row.offset_days,
    launch: row.launch,
    steps: steps.map((step) => ({
      id: String(step.id),
      stepIndex: step.step_index ?? 0,
      name: step.title,
      kind: step.kind,
      start: step.start_date,
      end: step.end_date,
      version: step.version,
      done: Boolean(step.done),
    })),
    createdAt: new Date(row.created_at).toISOString(),
  };
}

export class RunwayService {
  private readonly runways: RunwayRepository;
  private readonly events: EventRepository;
  private readonly templates: TemplateService;

  constructor(private readonly db: Knex) {
    this.runways = new RunwayRepository(db);
    this.events = new EventRepository(db);
    this.templates = new TemplateService(db);
  }

  private async plan(studio: StudioContext, body: RunwayPreviewBody): Promise<Planned> {
    const calendar = await loadStudioCalendar(this.db, studio.id);
    const anchor = body.anchor
      ? await resolveAnchor(calendar, this.runways, body.anchor.kind, body.anchor.value)
      : { date: body.anchorDate!, offsetDays: undefined, themeId: undefined };
    const offsetDays = body.offsetDays ?? anchor.offsetDays ?? 0;
    let steps: RunwayStep[];
    let template: string | null = null;
    let templateName: string | null = null;
    if (body.steps) steps = body.steps;
    else {
      const found = await this.templates.get(studio, body.templateId ?? DEFAULT_TEMPLATE_ID).catch((error: unknown) => {
        if (error instanceof AppError && error.status === 404) {
          throw new AppError('invalid_input', 400, `templateId: no template ${body.templateId} in this studio`, [{ path: ['templateId'], message: 'No such template' }]);
        }
        throw error;
      });
      steps = found.steps;
      template = String(found.id);
      templateName = found.name;
    }
    const from = addDays(minDate(calendar.today, anchor.date), -PLAN_REACH_DAYS);
    const to = addDays(maxDate(calendar.today, anchor.date), PLAN_REACH_DAYS);
    const bare = workCalendarOf(calendar, from, to);
    const booked = (await this.events.placedOutside(studio.id, null, from, to)).map(toPlacedStep);
    const work = bare.withBookings(bookingsFromEvents(booked.map((step) => ({ ...step, days: step.days.length ? step.days : undefined })), bare));
    const plan = planRunway({ anchorDate: anchor.date, offsetDays, steps, today: calendar.today }, work);
    return { calendar, anchorDate: anchor.date, offsetDays, themeId: anchor.themeId, steps, template, templateName, plan };
  }

  async preview(studio: StudioContext, body: RunwayPreviewBody): Promise<RunwayPreview> {
    return toPreview(await this.plan(studio, body));
  }

  async create(studio: StudioContext, userId: number, body: RunwayCreateBody): Promise<RunwayView & { preview: RunwayPreview }> {
    const planned = await this.plan(studio, body);
    const themeId = body.themeId ?? planned.themeId ?? null;
    const theme = themeId === null ? undefined : await this.runways.theme(studio.id, themeId);
    if (themeId !== null && !theme) {
      throw new AppError('invalid_input', 400, `themeId: no theme ${themeId} in this studio`, [{ path: ['themeId'], message: 'No such theme in this studio' }]);
    }
    const isTray = body.placement === 'tray';
    const id = await this.runways.insert(
      studio.id,
      {
        themeId,
        name: body.name ?? theme?.name ?? planned.templateName ?? 'Runway',
        template: planned.template,
        anchorKind: body.anchor?.kind ?? 'date',
        anchorValue: body.anchor?.value ?? body.anchorDate ?? null,
        anchorDate: planned.anchorDate,
        offsetDays: planned.offsetDays,
        launch: planned.plan.launch,
        createdBy: userId,
      },
      planned.plan.steps.map((step, index) => ({
        runwayId: null,
        themeId,
        stepIndex: index,
        kind: step.kind,
        title: step.name,
        start: isTray ? null : step.start,
        end: isTray ? null : step.end,
        days: isTray ? [] : step.days,
        workDays: step.workDays,
        hoursPerDay: step.hoursPerDay,
        cureDays: step.cureDays,
        cautions: step.cautions,
      })),
    );
    // A picked theme follows its runway: building once one is planned for it (its history says so);
    // an idea or shortlisted one stays as it is, its steps out of the tray until it is picked.
    if (themeId !== null) await new ThemesRepository(this.db).followRunway(studio.id, themeId, 'building', ['picked'], userId);
    const preview = toPreview(planned);
    if (theme?.target_date && theme.target_date !== planned.anchorDate) {
      preview.warnings.push({
        code: 'other-target',
        message: `${theme.name} is picked for ${theme.target_date}; this runway plans back from ${planned.anchorDate}`,
        dates: [theme.target_date, planned.anchorDate],
      });
    }
    return { ...(await this.get(studio, id)), preview };
  }

  async list(studio: StudioContext): Promise<RunwayView[]> {
    const rows = await this.runways.list(studio.id);
    const steps = await Promise.all(rows.map((row) => this.events.ofRunway(studio.id, row.id)));
    return rows.map((row, index) => toView(row, steps[index]));
  }

  async get(studio: StudioContext, id: number): Promise<RunwayView> {
    const row = await this.runways.find(studio.id, id);
    if (!row) throw notFound(`Runway ${id}`);
    return toView(row, await this.events.ofRunway(studio.id, id));
  }

  async remove(studio: StudioContext, id: number): Promise<void> {
    if ((await this.runways.delete(studio.id, id)) === 0) throw notFound(`Runway ${id}`);
  }
}
