import { ChangeDetectionStrategy, Component, effect, input, viewChild } from '@angular/core';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { ImportListItem } from '@shared/contracts/imports';

type Row = ImportListItem & { by: string; covered: string };

/** Every import of the studio: sortable and paginated. */
@Component({
  selector: 'kc-imports-table',
  imports: [MatTableModule, MatSortModule, MatPaginatorModule, RouterLink],
  template: `
    <table mat-table [dataSource]="dataSource" matSort matSortActive="createdAt" matSortDirection="desc" aria-label="Imports">
      <ng-container matColumnDef="fileName">
        <th mat-header-cell *matHeaderCellDef mat-sort-header>File</th>
        <td mat-cell *matCellDef="let row"><a [routerLink]="[row.id]">{{ row.fileName }}</a></td>
      </ng-container>
      @for (column of textColumns; track column.key) {
        <ng-container [matColumnDef]="column.key">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>{{ column.label }}</th>
          <td mat-cell *matCellDef="let row">{{ row[column.key] }}</td>
        </ng-container>
      }
      <ng-container matColumnDef="createdAt">
        <th mat-header-cell *matHeaderCellDef mat-sort-header>When</th>
        <td mat-cell *matCellDef="let row">{{ row.createdAt.slice(0, 16).replace('T', ' ') }}</td>
      </ng-container>
      <tr mat-header-row *matHeaderRowDef="columns"></tr>
      <tr mat-row *matRowDef="let row; columns: columns"></tr>
      <tr class="mat-row" *matNoDataRow>
        <td class="mat-cell empty" [attr.colspan]="columns.length">No imports yet.</td>
      </tr>
    </table>
    <mat-paginator [pageSizeOptions]="[10, 25, 50]" [pageSize]="10" aria-label="Pages of imports" />
  `,
  styles: `
    table { width: 100%; }
    .empty { padding: 16px; color: var(--mat-sys-on-surface-variant); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ImportsTable {
  readonly imports = input<ImportListItem[]>([]);
  protected readonly textColumns: { key: keyof Row; label: string }[] = [
    { key: 'kind', label: 'Kind' },
    { key: 'status', label: 'Status' },
    { key: 'rows', label: 'Rows' },
    { key: 'seriesCount', label: 'Series' },
    { key: 'covered', label: 'Period covered' },
    { key: 'by', label: 'By' },
  ];
  protected readonly columns = ['fileName', ...this.textColumns.map((column) => column.key), 'createdAt'];
  protected readonly dataSource = new MatTableDataSource<Row>([]);
  private readonly sort = viewChild.required(MatSort);
  private readonly paginator = viewChild.required(MatPaginator);

  constructor() {
    effect(() => {
      this.dataSource.data = this.imports().map((item) => ({
        ...item,
        by: item.createdBy?.name ?? '—',
        covered: item.periodStart ? `${item.periodStart} – ${item.periodEnd ?? ''}` : '—',
      }));
    });
    effect(() => {
      this.dataSource.sort = this.sort();
      this.dataSource.paginator = this.paginator();
    });
  }
}
