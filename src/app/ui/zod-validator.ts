import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';

interface FieldSchema {
  safeParse(value: unknown): { success: boolean; error?: { issues: { message: string }[] } };
}

/** Adapts one field of a shared zod schema to a form validator: the error key is `zod`, its value the message. */
export function zodValidator(schema: FieldSchema): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    const result = schema.safeParse(control.value);
    return result.success ? null : { zod: result.error?.issues[0]?.message ?? 'Invalid value' };
  };
}

/** The message to show under a field: the server's, else the shared schema's. */
export function fieldError(control: AbstractControl): string | null {
  const errors = control.errors;
  if (!errors) return null;
  return (errors['server'] as string | undefined) ?? (errors['zod'] as string | undefined) ?? null;
}
