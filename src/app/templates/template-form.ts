import { FormArray, FormControl, FormGroup, NonNullableFormBuilder } from '@angular/forms';
import type { RunwayTemplateView } from '@shared/contracts/runways';
import { runwayStepSchema, runwayTemplateSchema } from '@shared/planning/schemas';
import type { StepKind } from '@shared/planning/work-calendar';
import { zodValidator } from '../ui/zod-validator';

type Step = RunwayTemplateView['steps'][number];

export type StepForm = FormGroup<{
  name: FormControl<string>;
  kind: FormControl<StepKind>;
  workDays: FormControl<number>;
  hoursPerDay: FormControl<number>;
  cureDays: FormControl<number>;
  /** One caution a line, as the maker types them. */
  cautions: FormControl<string>;
}>;

export type TemplateForm = FormGroup<{ name: FormControl<string>; steps: FormArray<StepForm> }>;

const fields = runwayStepSchema.shape;
const linesOf = (text: string) => text.split('\n').map((line) => line.trim()).filter(Boolean);
// The cautions field is text; the shared schema checks the lines it stands for.
const cautionsSchema = { safeParse: (text: unknown) => fields.cautions.safeParse(linesOf(String(text))) };

export const blankStep: Step = { name: '', kind: 'build', workDays: 1, hoursPerDay: 4, cureDays: 0, cautions: [] };

export function stepForm(builder: NonNullableFormBuilder, step: Step): StepForm {
  return builder.group({
    name: [step.name, zodValidator(fields.name)],
    kind: [step.kind as StepKind, zodValidator(fields.kind)],
    workDays: [step.workDays, zodValidator(fields.workDays)],
    hoursPerDay: [step.hoursPerDay, zodValidator(fields.hoursPerDay)],
    cureDays: [step.cureDays, zodValidator(fields.cureDays)],
    cautions: [(step.cautions ?? []).join('\n'), zodValidator(cautionsSchema)],
  });
}

export function templateForm(builder: NonNullableFormBuilder, name: string, steps: readonly Step[]): TemplateForm {
  return builder.group({
    name: [name, zodValidator(runwayTemplateSchema.shape.name)],
    steps: builder.array(steps.map((step) => stepForm(builder, step))),
  });
}

/** The body POST and PUT take: numbers as numbers, cautions as lines. */
export function templateBody(form: TemplateForm): { name: string; steps: Step[] } {
  const value = form.getRawValue();
  return {
    name: value.name.trim(),
    steps: value.steps.map((step) => ({
      name: step.name.trim(),
      kind: step.kind,
      workDays: Number(step.workDays),
      hoursPerDay: Number(step.hoursPerDay),
      cureDays: Number(step.cureDays),
      cautions: linesOf(step.cautions),
    })),
  };
}
