import { HttpClient, HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, input, OnInit, output, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { firstValueFrom } from 'rxjs';
import type { RunwayTemplateView } from '@shared/contracts/runways';
import { CAUTION_REMINDER } from '@shared/planning/built-in-templates';
import { applyServerIssues } from '../core/api-error';
import { StudioContext } from '../core/studio-context';
import { fieldError } from '../ui/zod-validator';
import { blankStep, stepForm, templateBody, templateForm } from './template-form';

/** What the editor opens on: a studio template to change, or a starting point for a new one. */
export interface TemplateDraft {
  /** The studio template being changed; absent for a new one (empty or a copy). */
  template?: RunwayTemplateView;
  name: string;
  steps: RunwayTemplateView['steps'];
}

/**
 * Edits a studio template's name and steps (add, remove, move up or down; name, kind, work days,
 * hours a day, cure days, cautions a line each) and saves it with its version, so a change made
 * meanwhile by someone else answers 409 instead of being overwritten.
 */
@Component({
  selector: 'kc-template-editor',
  imports: [ReactiveFormsModule, MatButtonModule, MatCardModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  templateUrl: './template-editor.html',
  styleUrl: './template-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TemplateEditor implements OnInit {
  private readonly http = inject(HttpClient);
  private readonly context = inject(StudioContext);
  private readonly builder = inject(NonNullableFormBuilder);
  protected readonly fieldError = fieldError;
  protected readonly reminder = CAUTION_REMINDER;
  protected readonly kinds = ['build', 'content', 'launch'] as const;
  // The bounds mirror runwayStepSchema; the schema's own validators give the messages.
  protected readonly numberFields = [
    { key: 'workDays', label: 'Work days', max: 120, step: 1 },
    { key: 'hoursPerDay', label: 'Hours a day', max: 24, step: 0.5 },
    { key: 'cureDays', label: 'Cure days', max: 120, step: 1 },
  ] as const;

  readonly draft = input.required<TemplateDraft>();
  readonly saved = output<RunwayTemplateView>();
  readonly closed = output<void>();

  protected form = templateForm(this.builder, '', []);
  protected readonly isBusy = signal(false);
  protected readonly formError = signal<string | null>(null);

  ngOnInit(): void {
    this.form = templateForm(this.builder, this.draft().name, this.draft().steps);
  }

  protected get steps() {
    return this.form.controls.steps;
  }

  protected addStep(): void {
    this.steps.push(stepForm(this.builder, blankStep));
  }

  protected removeStep(index: number): void {
    this.steps.removeAt(index);
  }

  protected move(index: number, by: -1 | 1): void {
    const step = this.steps.at(index);
    this.steps.removeAt(index, { emitEvent: false });
    this.steps.insert(index + by, step);
  }

  protected async save(): Promise<void> {
    this.formError.set(null);
    if (this.steps.length === 0) this.formError.set('Add at least one step');
    if (this.form.invalid || this.steps.length === 0) {
      this.form.markAllAsTouched();
      return;
    }
    const template = this.draft().template;
    const base = `${this.context.base()}/runway-templates`;
    const body = templateBody(this.form);
    this.isBusy.set(true);
    try {
      const answer = template
        ? await firstValueFrom(this.http.put<RunwayTemplateView>(`${base}/${template.id}`, { ...body, version: template.version }))
        : await firstValueFrom(this.http.post<RunwayTemplateView>(base, body));
      this.saved.emit(answer);
    } catch (error) {
      const message = applyServerIssues(this.form, error);
      this.formError.set(error instanceof HttpErrorResponse && error.status === 409 ? 'Someone else changed this template meanwhile; close it and open it again to see their change.' : message);
    } finally {
      this.isBusy.set(false);
    }
  }
}
