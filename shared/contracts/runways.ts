// Runways, templates and moves of stored steps as the API takes and gives them. The planning
// rules are in shared/planning; the calendar shapes (CalendarEvent, MoveResult...) in ./calendar.
import './zod';
import * as z from 'zod/mini';
import { isoDateSchema } from '../calendar/schemas';
import { BUILT_IN_TEMPLATE_IDS, type BuiltInTemplateId } from '../planning/built-in-templates';
import { runwayStepSchema, runwayTemplateSchema } from '../planning/schemas';
import type { PlanWarningView } from './calendar';
import { safeName, safeNote, safeTextAt } from './text';

export const anchorKinds = ['date', 'holiday', 'occasion', 'market', 'theme'] as const;
export type AnchorKind = (typeof anchorKinds)[number];

/**
 * What a runway is planned back from. value: a date (kind date); a holiday or occasion key, alone
 * (its next date from today) or as "key:YYYY-MM-DD"; a market id, alone or "id:YYYY-MM-DD"; a theme id
 * (its target). /occasions/upcoming lists values ready to send.
 */
export const anchorSchema = z.object({
  kind: z.enum(anchorKinds),
  value: z.string().check(z.trim(), z.minLength(1), z.maxLength(80)),
});

/** The first built-in template's id, used when a plan names none; the studio's own templates have numeric ids. */
export const DEFAULT_TEMPLATE_ID = 'default';
export type { BuiltInTemplateId };
/** A built-in template's id (read-only, in code) or a studio template's numeric id. */
export type TemplateId = number | BuiltInTemplateId;
// Step names come from shared/planning; the contract adds the checks every typed name gets.
const stepsSchema = z
  .array(runwayStepSchema.check(safeTextAt<z.infer<typeof runwayStepSchema>>('name', 'Step name')))
  .check(z.minLength(1), z.maxLength(40));

const templateIdSchema = z.union([z.int().check(z.positive()), z.enum(BUILT_IN_TEMPLATE_IDS)]);

const previewFields = {
  anchorDate: z.optional(isoDateSchema),
  anchor: z.optional(anchorSchema),
  /** Calendar days the launch comes before the anchor; a theme anchor defaults to its own offset. */
  offsetDays: z.optional(z.int().check(z.minimum(0), z.maximum(366))),
  steps: z.optional(stepsSchema),
  templateId: z.optional(templateIdSchema),
};

function previewChecks<T extends { anchorDate?: string; anchor?: unknown; steps?: unknown; templateId?: unknown }>() {
  return [
    z.refine<T>((request) => (request.anchorDate === undefined) !== (request.anchor === undefined), {
      message: 'Give either anchorDate or anchor',
      path: ['anchorDate'],
    }),
    z.refine<T>((request) => !(request.steps !== undefined && request.templateId !== undefined), {
      message: 'Give either steps or templateId, not both',
      path: ['steps'],
    }),
  ];
}

/** POST /runways/preview. Without steps or templateId the default template is used. */
export const runwayPreviewBodySchema = z.object(previewFields).check(...previewChecks());
export type RunwayPreviewBody = z.infer<typeof runwayPreviewBodySchema>;

/** POST /runways: a preview plus what to link and where the steps go. */
export const runwayCreateBodySchema = z
  .object({
    ...previewFields,
    themeId: z.optional(z.nullable(z.int().check(z.positive()))),
    name: z.optional(z.string().check(z.trim(), z.minLength(1), z.maxLength(120), ...safeName('Runway name'))),
    /** 'calendar' (default) dates the steps; 'tray' stores them unscheduled. */
    placement: z.optional(z.enum(['calendar', 'tray'])),
  })
  .check(...previewChecks());
export type RunwayCreateBody = z.infer<typeof runwayCreateBodySchema>;

export interface RunwayPreviewStep {
  name: string;
  kind: 'build' | 'content' | 'launch';
  start: string;
  end: string;
  workDays: number;
  hoursPerDay: number;
  cureDays: number;
  days: string[];
  cautions: string[];
}

export interface RunwayPreview {
  anchorDate: string;
  offsetDays: number;
  launch: string;
  start: string;
  steps: RunwayPreviewStep[];
  warnings: PlanWarningView[];
}

export interface RunwayView {
  id: number;
  name: string;
  themeId: number | null;
  themeName: string | null;
  template: string | null;
  anchor: { kind: AnchorKind; value: string | null };
  anchorDate: string;
  offsetDays: number;
  launch: string;
  /** The stored steps in order, with their current dates (null = in the tray). */
  steps: {
    id: string;
    stepIndex: number;
    name: string;
    kind: 'build' | 'content' | 'launch';
    start: string | null;
    end: string | null;
    version: number;
    done: boolean;
  }[];
  createdAt: string;
}

const templateName = safeTextAt<{ name: string }>('name', 'Template name');
export const templateBodySchema = z.object({ ...runwayTemplateSchema.shape, steps: stepsSchema }).check(templateName);
export const templateUpdateSchema = z
  .object({ ...runwayTemplateSchema.shape, steps: stepsSchema, version: z.optional(z.int()) })
  .check(templateName);

export interface RunwayTemplateView {
  id: TemplateId;
  name: string;
  /** Whether it is a built-in template (read-only). */
  isBuiltIn: boolean;
  steps: z.infer<typeof runwayStepSchema>[];
  version: number;
}

/** PATCH /events/:eventId — one of: a move ({start, end?, version, force?}; start null puts it back in
 * the tray; the server places the step's work days from start and answers the end), an edit
 * ({title?, notes?, assigneeId?, version}) or a tick ({done, version}). */
export const eventPatchSchema = z
  .object({
    version: z.int(),
    start: z.optional(z.nullable(isoDateSchema)),
    end: z.optional(z.nullable(isoDateSchema)),
    /** Whether to store a move that breaks a rule (the answer still carries the warnings). */
    force: z.optional(z.boolean()),
    title: z.optional(z.string().check(z.trim(), z.minLength(1), z.maxLength(120), ...safeName('Title'))),
    notes: z.optional(z.nullable(z.string().check(z.maxLength(4000), ...safeNote('Notes')))),
    assigneeId: z.optional(z.nullable(z.int().check(z.positive()))),
    done: z.optional(z.boolean()),
  })
  .check(
    z.refine((patch) => !(patch.start && patch.end && patch.end < patch.start), {
      message: 'end cannot be before start',
      path: ['end'],
    }),
  );
export type EventPatch = z.infer<typeof eventPatchSchema>;
