import { signal } from '@angular/core';
import type { FormGroup } from '@angular/forms';
import { applyServerIssues } from '../core/api-error';

/**
 * The submit cycle every form shares: touch and check the controls, run the request once at a
 * time, and put a failed answer's issues on the controls they name (the rest in `formError`).
 */
export class FormSubmission {
  readonly isBusy = signal(false);
  readonly formError = signal<string | null>(null);

  constructor(private readonly form: FormGroup) {}

  /** Runs `action` when the form is valid (or `isChecked` is false) and nothing else is running. */
  async run(action: () => Promise<unknown>, { isChecked = true } = {}): Promise<void> {
    if (isChecked) {
      this.form.markAllAsTouched();
      if (this.form.invalid) return;
    }
    if (this.isBusy()) return;
    this.isBusy.set(true);
    this.formError.set(null);
    try {
      await action();
    } catch (error) {
      this.formError.set(applyServerIssues(this.form, error));
    } finally {
      this.isBusy.set(false);
    }
  }
}
