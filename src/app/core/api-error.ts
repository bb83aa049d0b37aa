import { HttpErrorResponse } from '@angular/common/http';
import type { AbstractControl, FormGroup } from '@angular/forms';

export interface ApiErrorBody {
  error: { code: string; message: string; issues?: { path: (string | number)[]; message: string }[] };
}

export function messageOf(error: unknown): string {
  if (error instanceof HttpErrorResponse) {
    if (error.status === 0) return 'The server cannot be reached; check your connection';
    const body = error.error as Partial<ApiErrorBody> | null;
    return body?.error?.message ?? `The server answered ${error.status}`;
  }
  return error instanceof Error ? error.message : 'Something went wrong';
}

/** Puts each server issue on the form control it names; returns the message of any issue left over. */
export function applyServerIssues(form: FormGroup, error: unknown): string | null {
  if (!(error instanceof HttpErrorResponse)) return messageOf(error);
  const issues = (error.error as Partial<ApiErrorBody> | null)?.error?.issues ?? [];
  const leftOver: string[] = [];
  for (const issue of issues) {
    const control: AbstractControl | null = form.get(issue.path.map(String).join('.'));
    if (control) {
      control.setErrors({ server: issue.message });
      control.markAsTouched();
    } else leftOver.push(issue.message);
  }
  return issues.length === 0 ? messageOf(error) : leftOver.length ? leftOver.join('; ') : null;
}
