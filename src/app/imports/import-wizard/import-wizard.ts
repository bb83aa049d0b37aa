import { HttpClient, HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, input, OnInit, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { MatStepperModule } from '@angular/material/stepper';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { CommitResult, ImportDetail, ImportPreview, PreviewChange } from '@shared/contracts/imports';
import type { CsvMapping } from '@shared/csv/csv-types';
import type { ApiErrorBody } from '../../core/api-error';
import { messageOf } from '../../core/api-error';
import { ColumnMapping, layoutLabels } from '../column-mapping/column-mapping';
import { ImportsApi } from '../imports-api';

interface ShownIssue {
  row?: number;
  column?: string;
  message: string;
}

const delimiterNames: Record<string, string> = { ',': 'comma', ';': 'semicolon', '\t': 'tab' };
const pollEveryMs = 400;

/** One file's way through upload → map → check → commit. */
@Component({
  selector: 'kc-import-wizard',
  imports: [
    RouterLink,
    MatCardModule,
    MatStepperModule,
    MatProgressBarModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatRadioModule,
    MatIconModule,
    ColumnMapping,
  ],
  templateUrl: './import-wizard.html',
  styleUrls: ['../import-facts.scss', './import-wizard.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ImportWizard implements OnInit {
  private readonly api = inject(ImportsApi);
  private readonly http = inject(HttpClient);
  private readonly destroyRef = inject(DestroyRef);

  readonly file = input.required<File>();
  readonly committed = output<CommitResult>();
  readonly dismissed = output<void>();

  protected readonly step = signal(0);
  protected readonly uploadFraction = signal(0);
  protected readonly preview = signal<ImportPreview | null>(null);
  protected readonly error = signal<{ message: string; issues: ShownIssue[] } | null>(null);
  protected readonly isBusy = signal(false);
  protected readonly onDuplicate = signal<'skip' | 'replace' | null>(null);
  protected readonly commitState = signal<'idle' | 'committing' | 'done'>('idle');
  protected readonly commitFraction = signal(0);
  protected readonly result = signal<CommitResult | null>(null);
  protected readonly layoutLabels = layoutLabels;
  protected readonly delimiterNames = delimiterNames;

  protected readonly errors = computed(() => this.preview()?.problems.filter((problem) => problem.severity === 'error') ?? []);
  protected readonly blocker = computed(() => {
    const preview = this.preview();
    if (!preview) return 'Upload the file first';
    if (preview.hasErrors) return `${this.errors().length} problem(s) must be fixed in the file or the mapping first`;
    if (preview.dateAmbiguous && !preview.dateOrder) return 'Choose the date order on the map step first';
    if (preview.duplicateOf && !this.onDuplicate()) return 'Choose whether to skip or replace the earlier import';
    return null;
  });
  protected readonly dateExample = computed(() => {
    const preview = this.preview();
    const index = preview?.columns.find((column) => column.role === 'date')?.index ?? 0;
    return preview?.sample[0]?.[index] ?? '';
  });
  /** Returns stay in the sales as negative quantities; the check step says how many there are. */
  protected readonly returnsLine = computed(() => {
    const count = this.preview()?.returnRows ?? 0;
    if (count === 0) return null;
    return `${count} ${count === 1 ? 'row is a return' : 'rows are returns'} (negative quantity); they are stored as negative sales.`;
  });
  protected readonly headerCells = computed(() => this.preview()?.columns.map((column) => column.name) ?? []);

  private isAlive = true;

  constructor() {
    this.destroyRef.onDestroy(() => (this.isAlive = false));
  }

  ngOnInit(): void {
    const subscription = this.api.upload(this.file()).subscribe({
      next: (event) => {
        if (event.kind === 'progress') this.uploadFraction.set(event.fraction);
        else {
          this.uploadFraction.set(1);
          this.preview.set(event.preview);
          this.step.set(1);
        }
      },
      error: (error: unknown) => this.showError(error),
    });
    this.destroyRef.onDestroy(() => subscription.unsubscribe());
  }

  protected async changePreview(change: PreviewChange): Promise<void> {
    const preview = this.preview();
    if (!preview || this.isBusy()) return;
    this.isBusy.set(true);
    this.error.set(null);
    try {
      this.preview.set(await firstValueFrom(this.api.changePreview(preview.id, change)));
    } catch (error) {
      this.showError(error);
    } finally {
      this.isBusy.set(false);
    }
  }

  protected applyMapping(mapping: CsvMapping): Promise<void> {
    return this.changePreview({ mapping: mapping as unknown as Record<string, unknown> });
  }

  protected async commit(): Promise<void> {
    const preview = this.preview();
    if (!preview || this.blocker() || this.commitState() !== 'idle') return;
    this.commitState.set('committing');
    this.commitFraction.set(0);
    this.error.set(null);
    const polling = this.pollProgress(preview.id, preview.rows);
    try {
      const result = await firstValueFrom(this.api.commit(preview.id, this.onDuplicate() ? { onDuplicate: this.onDuplicate()! } : {}));
      this.commitFraction.set(1);
      this.result.set(result);
      this.commitState.set('done');
      this.committed.emit(result);
    } catch (error) {
      this.commitState.set('idle');
      this.showError(error);
    } finally {
      polling.stop();
    }
  }

  private pollProgress(importId: number, rows: number) {
    let isRunning = true;
    const tick = async () => {
      while (isRunning && this.isAlive) {
        await new Promise((resolve) => setTimeout(resolve, pollEveryMs));
        if (!isRunning) break;
        try {
          const detail = await firstValueFrom(this.http.get<ImportDetail>(this.api.url(`/${importId}`)));
          if (isRunning && detail.status === 'committing' && rows > 0) this.commitFraction.set(Math.min(1, detail.progressRows / rows));
        } catch {
          // A missed poll only delays the bar.
        }
      }
    };
    void tick();
    return { stop: () => (isRunning = false) };
  }

  private showError(error: unknown): void {
    const body = error instanceof HttpErrorResponse ? (error.error as Partial<ApiErrorBody> | null) : null;
    const issues = (body?.error?.issues ?? []) as ShownIssue[];
    this.error.set({ message: messageOf(error), issues: issues.filter((issue) => issue.row !== undefined).slice(0, 50) });
  }
}
