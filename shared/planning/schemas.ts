import * as z from 'zod/mini';
import { isoDateSchema } from '../calendar/schemas';

export const stepKindSchema = z.enum(['build', 'content', 'launch']);

export const runwayStepSchema = z.object({
  name: z.string().check(z.trim(), z.minLength(1), z.maxLength(80)),
  kind: stepKindSchema,
  /** 0 makes the step a milestone (a launch). */
  workDays: z.int().check(z.minimum(0), z.maximum(120)),
  hoursPerDay: z.number().check(z.minimum(0), z.maximum(24)),
  cureDays: z.int().check(z.minimum(0), z.maximum(120)),
  cautions: z.optional(z.array(z.string().check(z.maxLength(300))).check(z.maxLength(20))),
});

export const runwayTemplateSchema = z.object({
  name: z.string().check(z.trim(), z.minLength(1), z.maxLength(120)),
  steps: z.array(runwayStepSchema).check(z.minLength(1), z.maxLength(40)),
});

/** POST /runways/preview: steps inline, or a stored template by id. */
export const runwayPreviewRequestSchema = z
  .object({
    anchorDate: isoDateSchema,
    /** Calendar days the launch comes before the anchor. */
    offsetDays: z.int().check(z.minimum(0), z.maximum(366)),
    steps: z.optional(z.array(runwayStepSchema).check(z.minLength(1), z.maxLength(40))),
    templateId: z.optional(z.int().check(z.positive())),
  })
  .check(
    z.refine((request) => (request.steps === undefined) !== (request.templateId === undefined), {
      message: 'Give either steps or templateId',
      path: ['steps'],
    }),
  );

export const workCalendarSettingsSchema = z.object({
  workDays: z.array(z.int().check(z.minimum(1), z.maximum(7))).check(
    z.minLength(1),
    z.refine((days) => new Set(days).size === days.length, {
      message: 'A work day is listed twice',
    }),
  ),
  dailyCapacityHours: z.number().check(z.positive(), z.maximum(24)),
  /** Whether public holidays are days off. */
  holidaysOff: z.boolean(),
});

export const planWarningSchema = z.object({
  code: z.enum(['too-short', 'capacity', 'blackout', 'order', 'cure']),
  message: z.string(),
  stepIndex: z.optional(z.int()),
  dates: z.optional(z.array(isoDateSchema)),
  shortByWorkDays: z.optional(z.int()),
  firstFeasibleLaunch: z.optional(isoDateSchema),
});

export const placedStepSchema = z.object({
  name: z.string(),
  kind: stepKindSchema,
  workDays: z.int(),
  hoursPerDay: z.number(),
  cureDays: z.int(),
  start: isoDateSchema,
  end: isoDateSchema,
  days: z.array(isoDateSchema),
  cautions: z.array(z.string()),
});

export const runwayPreviewResponseSchema = z.object({
  launch: isoDateSchema,
  start: isoDateSchema,
  steps: z.array(placedStepSchema),
  warnings: z.array(planWarningSchema),
});

export type RunwayStepInput = z.infer<typeof runwayStepSchema>;
export type RunwayTemplateInput = z.infer<typeof runwayTemplateSchema>;
export type RunwayPreviewRequest = z.infer<typeof runwayPreviewRequestSchema>;
export type RunwayPreviewResponse = z.infer<typeof runwayPreviewResponseSchema>;
