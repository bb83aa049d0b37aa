import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { ImportListItem } from '@shared/contracts/imports';
import { StudioContext } from '../../core/studio-context';
import { ImportWizard } from '../import-wizard/import-wizard';
import { ImportsTable } from '../imports-table/imports-table';

let nextKey = 1;

/** The Imports page: a drop zone and one wizard per file for owner and partner, the list for all. */
@Component({
  selector: 'kc-imports-page',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, ImportWizard, ImportsTable],
  templateUrl: './imports-page.html',
  styleUrl: './imports-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ImportsPage {
  protected readonly context = inject(StudioContext);
  protected readonly files = signal<{ key: number; file: File }[]>([]);
  protected readonly isDragging = signal(false);
  protected readonly imports = httpResource<ImportListItem[]>(() =>
    this.context.studioId() === null ? undefined : `${this.context.base()}/imports`,
  );

  protected addFiles(list: FileList | null | undefined): void {
    if (!list) return;
    const added = [...list].map((file) => ({ key: nextKey++, file }));
    this.files.update((files) => [...added, ...files]);
  }

  protected picked(event: Event): void {
    const inputElement = event.target as HTMLInputElement;
    this.addFiles(inputElement.files);
    inputElement.value = '';
  }

  protected dropped(event: DragEvent): void {
    event.preventDefault();
    this.isDragging.set(false);
    this.addFiles(event.dataTransfer?.files);
  }

  protected dragOver(event: DragEvent): void {
    event.preventDefault();
    this.isDragging.set(true);
  }

  protected dismiss(key: number): void {
    this.files.update((files) => files.filter((entry) => entry.key !== key));
    this.imports.reload();
  }
}
