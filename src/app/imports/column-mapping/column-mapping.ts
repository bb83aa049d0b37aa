import { ChangeDetectionStrategy, Component, computed, effect, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import type { ColumnRole, CsvColumn, CsvLayout, CsvMapping } from '@shared/csv/csv-types';

/** What each layout lets a column be, with the words the screen uses. */
const roleChoices: Record<CsvLayout, { role: ColumnRole; label: string; isRequired?: boolean; isMany?: boolean }[]> = {
  wide: [
    { role: 'date', label: 'Date', isRequired: true },
    { role: 'series', label: 'Search term (one series)', isRequired: true, isMany: true },
  ],
  long: [
    { role: 'date', label: 'Date', isRequired: true },
    { role: 'term', label: 'Search term', isRequired: true },
    { role: 'value', label: 'Interest value', isRequired: true },
    { role: 'region', label: 'Region' },
  ],
  sales: [
    { role: 'date', label: 'Date', isRequired: true },
    { role: 'item', label: 'Item name', isRequired: true },
    { role: 'sku', label: 'SKU' },
    { role: 'quantity', label: 'Quantity', isRequired: true },
    { role: 'revenue', label: 'Revenue', isRequired: true },
    { role: 'channel', label: 'Channel' },
    { role: 'currency', label: 'Currency' },
  ],
};

export const layoutLabels: Record<CsvLayout, string> = {
  wide: 'Search interest, one column per term',
  long: 'Search interest, one row per date and term',
  sales: 'Sales, one row per sale or item-day',
};

/** Builds the API's mapping from the roles chosen per column; returns the reason when it cannot. */
export function mappingFromRoles(layout: CsvLayout, roles: Record<string, ColumnRole>): { mapping: CsvMapping | null; error: string | null } {
  const columnsWith = (role: ColumnRole) => Object.keys(roles).filter((name) => roles[name] === role);
  for (const choice of roleChoices[layout]) {
    const count = columnsWith(choice.role).length;
    if (choice.isRequired && count === 0) return { mapping: null, error: `Choose a column for "${choice.label}"` };
    if (!choice.isMany && count > 1) return { mapping: null, error: `Only one column can be "${choice.label}"` };
  }
  const one = (role: ColumnRole) => columnsWith(role)[0];
  const optional = (key: string, role: ColumnRole) => (one(role) === undefined ? {} : { [key]: one(role) });
  if (layout === 'wide') return { mapping: { date: one('date'), terms: columnsWith('series') }, error: null };
  if (layout === 'long') {
    return { mapping: { date: one('date'), term: one('term'), value: one('value'), ...optional('region', 'region') }, error: null };
  }
  const mapping = {
    date: one('date'),
    item: one('item'),
    quantity: one('quantity'),
    revenue: one('revenue'),
    ...optional('sku', 'sku'),
    ...optional('channel', 'channel'),
    ...optional('currency', 'currency'),
  };
  return { mapping, error: null };
}

/** The map step: every column of the file with what it is mapped to, editable. */
@Component({
  selector: 'kc-column-mapping',
  imports: [MatFormFieldModule, MatSelectModule, MatButtonModule],
  templateUrl: './column-mapping.html',
  styleUrl: './column-mapping.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ColumnMapping {
  readonly columns = input.required<CsvColumn[]>();
  readonly layout = input.required<CsvLayout>();
  readonly isBusy = input(false);
  /** Emits a corrected mapping for the server to check again. */
  readonly apply = output<CsvMapping>();

  protected readonly layouts = Object.entries(layoutLabels) as [CsvLayout, string][];
  protected readonly chosenLayout = signal<CsvLayout>('wide');
  protected readonly roles = signal<Record<string, ColumnRole>>({});
  protected readonly choices = computed(() => roleChoices[this.chosenLayout()]);
  protected readonly result = computed(() => mappingFromRoles(this.chosenLayout(), this.roles()));
  protected readonly isChanged = signal(false);

  constructor() {
    effect(() => {
      const roles: Record<string, ColumnRole> = {};
      for (const column of this.columns()) if (column.name !== '' && !(column.name in roles)) roles[column.name] = column.role;
      this.roles.set(roles);
      this.chosenLayout.set(this.layout());
      this.isChanged.set(false);
    });
  }

  protected setLayout(layout: CsvLayout): void {
    this.chosenLayout.set(layout);
    const allowed = new Set(roleChoices[layout].map((choice) => choice.role));
    this.roles.update((roles) =>
      Object.fromEntries(Object.entries(roles).map(([name, role]) => [name, allowed.has(role) ? role : 'ignored'])),
    );
    this.isChanged.set(true);
  }

  protected setRole(column: string, role: ColumnRole): void {
    this.roles.update((roles) => ({ ...roles, [column]: role }));
    this.isChanged.set(true);
  }

  protected applyMapping(): void {
    const { mapping } = this.result();
    if (mapping) this.apply.emit(mapping);
  }
}
