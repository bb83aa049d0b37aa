import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { CsvColumn, CsvMapping } from '@shared/csv/csv-types';
import { ColumnMapping, mappingFromRoles } from './column-mapping';

const wideColumns: CsvColumn[] = [
  { index: 0, name: 'Week', role: 'date' },
  { index: 1, name: 'lantern panel', role: 'series', term: 'lantern panel' },
  { index: 2, name: 'notes', role: 'series', term: 'notes' },
];

async function setUp(columns: CsvColumn[] = wideColumns, layout: 'wide' | 'long' | 'sales' = 'wide') {
  TestBed.configureTestingModule({ imports: [ColumnMapping] });
  const fixture = TestBed.createComponent(ColumnMapping);
  fixture.componentRef.setInput('columns', columns);
  fixture.componentRef.setInput('layout', layout);
  const emitted: CsvMapping[] = [];
  fixture.componentInstance.apply.subscribe((mapping) => emitted.push(mapping));
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  return {
    fixture,
    emitted,
    select: (column: string) => loader.getHarness(MatSelectHarness.with({ selector: `[data-column="${column}"]` })),
    layoutSelect: () => loader.getHarness(MatSelectHarness.with({ selector: '[data-testid=layout]' })),
    apply: () => loader.getHarness(MatButtonHarness.with({ text: 'Check with this mapping' })),
  };
}

describe('ColumnMapping', () => {
  it('when it opens, then every column shows what it is mapped to and nothing can be applied yet', async () => {
    const { select, apply } = await setUp();
    expect(await (await select('Week')).getValueText()).toBe('Date');
    expect(await (await select('lantern panel')).getValueText()).toBe('Search term (one series)');
    expect(await (await apply()).isDisabled()).toBe(true);
  });

  it('when a column is set to not imported, then the mapping without it is emitted', async () => {
    const { select, apply, emitted, fixture } = await setUp();
    const notes = await select('notes');
    await notes.open();
    await notes.clickOptions({ text: 'Not imported' });
    await fixture.whenStable();
    await (await apply()).click();
    expect(emitted).toEqual([{ date: 'Week', terms: ['lantern panel'] }]);
  });

  it('when the layout becomes sales, then the roles on offer change and missing required columns are named', async () => {
    const { layoutSelect, select, apply, fixture } = await setUp();
    const layout = await layoutSelect();
    await layout.open();
    await layout.clickOptions({ text: 'Sales, one row per sale or item-day' });
    await fixture.whenStable();
    const notes = await select('notes');
    await notes.open();
    const options = await notes.getOptions();
    expect(await Promise.all(options.map((option) => option.getText()))).toEqual([
      'Date', 'Item name', 'SKU', 'Quantity', 'Revenue', 'Channel', 'Currency', 'Not imported',
    ]);
    await notes.close();
    expect(fixture.nativeElement.querySelector('[role=alert]').textContent).toContain('Choose a column for "Item name"');
    expect(await (await apply()).isDisabled()).toBe(true);
  });

  it('when two columns both claim a single role, then it says so', () => {
    expect(mappingFromRoles('long', { a: 'date', b: 'term', c: 'term', d: 'value' }).error).toBe('Only one column can be "Search term"');
    expect(mappingFromRoles('long', { a: 'date', b: 'term', d: 'value', e: 'region' }).mapping).toEqual({ date: 'a', term: 'b', value: 'd', region: 'e' });
  });
});
