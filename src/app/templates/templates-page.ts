import { HttpClient, httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { firstValueFrom } from 'rxjs';
import type { RunwayTemplateView } from '@shared/contracts/runways';
import { messageOf } from '../core/api-error';
import { valueOr } from '../core/resource-value';
import { StudioContext } from '../core/studio-context';
import { Confirmer } from '../ui/confirm-dialog';
import { blankStep } from './template-form';
import { TemplateEditor, type TemplateDraft } from './template-editor';

/**
 * The runway templates every member can read: the built-in ones (code, read-only, copied to edit)
 * and the studio's own. A runway copies its steps when planned, so changing a template here never
 * moves or renames steps already on the calendar.
 */
@Component({
  selector: 'kc-templates-page',
  imports: [MatButtonModule, MatCardModule, MatIconModule, TemplateEditor],
  templateUrl: './templates-page.html',
  styleUrl: './templates-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TemplatesPage {
  private readonly http = inject(HttpClient);
  private readonly snackBar = inject(MatSnackBar);
  private readonly confirmer = inject(Confirmer);
  protected readonly context = inject(StudioContext);

  protected readonly templates = httpResource<RunwayTemplateView[]>(() => (this.context.studioId() === null ? undefined : `${this.context.base()}/runway-templates`));
  protected readonly list = () => valueOr(this.templates, [] as RunwayTemplateView[]);

  /** What the editor is open on, or null while it is closed. */
  protected readonly draft = signal<TemplateDraft | null>(null);

  protected create(): void {
    this.draft.set({ name: '', steps: [{ ...blankStep }] });
  }

  protected copy(template: RunwayTemplateView): void {
    this.draft.set({ name: `${template.name} (copy)`, steps: template.steps });
  }

  protected edit(template: RunwayTemplateView): void {
    this.draft.set({ template, name: template.name, steps: template.steps });
  }

  protected saved(template: RunwayTemplateView): void {
    this.snackBar.open(`${template.name} saved`, undefined, { duration: 3000 });
    this.draft.set(null);
    this.templates.reload();
  }

  protected async remove(template: RunwayTemplateView): Promise<void> {
    const message = 'Runways already planned from it keep their steps.';
    if (!(await this.confirmer.ask({ title: `Delete ${template.name}?`, message, action: 'Delete the template' }))) return;
    try {
      await firstValueFrom(this.http.delete(`${this.context.base()}/runway-templates/${template.id}`));
      this.snackBar.open(`${template.name} deleted`, undefined, { duration: 3000 });
    } catch (error) {
      this.snackBar.open(messageOf(error), 'Dismiss', { duration: 8000 });
    } finally {
      this.templates.reload();
    }
  }

  protected totalDays(template: RunwayTemplateView): string {
    const work = template.steps.reduce((total, step) => total + step.workDays, 0);
    const cure = template.steps.reduce((total, step) => total + step.cureDays, 0);
    return cure ? `${work} work days + ${cure} cure days` : `${work} work days`;
  }
}
