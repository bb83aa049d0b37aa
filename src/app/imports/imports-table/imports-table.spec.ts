import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import type { ImportListItem } from '@shared/contracts/imports';
import { ImportsTable } from './imports-table';

const imports: ImportListItem[] = Array.from({ length: 12 }, (_, i) => ({
  id: i + 1,
  fileName: `file-${String(i + 1).padStart(2, '0')}.csv`,
  kind: i % 2 ? 'sales' : 'interest',
  layout: i % 2 ? 'sales' : 'wide',
  status: 'committed',
  rows: (i * 37) % 100,
  seriesCount: i,
  salesRows: 0,
  periodStart: '2024-01-07',
  periodEnd: '2025-12-28',
  createdBy: { id: 1, name: 'owner person' },
  createdAt: `2026-11-${String(i + 1).padStart(2, '0')}T10:00:00.000Z`,
  committedAt: null,
}));

async function setUp() {
  TestBed.configureTestingModule({ imports: [ImportsTable], providers: [provideRouter([])] });
  const fixture = TestBed.createComponent(ImportsTable);
  fixture.componentRef.setInput('imports', imports);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  return { fixture, loader, table: await loader.getHarness(MatTableHarness) };
}

const column = async (table: MatTableHarness, name: string) => (await table.getCellTextByColumnName())[name].text;

describe('ImportsTable', () => {
  it('when it shows twelve imports, then the newest ten come first and the paginator holds the rest', async () => {
    const { table, loader } = await setUp();
    expect(await column(table, 'fileName')).toEqual(imports.slice(2).reverse().map((item) => item.fileName));
    expect(await column(table, 'covered')).toContain('2024-01-07 – 2025-12-28');
    const paginator = await loader.getHarness(MatPaginatorHarness);
    await paginator.goToNextPage();
    expect(await column(table, 'fileName')).toEqual(['file-02.csv', 'file-01.csv']);
  });

  it('when the rows header is clicked, then the table sorts by rows', async () => {
    const { table, loader } = await setUp();
    const sort = await loader.getHarness(MatSortHarness);
    const [rowsHeader] = await sort.getSortHeaders({ label: 'Rows' });
    await rowsHeader.click();
    const rows = (await column(table, 'rows')).map(Number);
    expect(rows).toEqual([...rows].sort((a, b) => a - b));
    expect(rows[0]).toBe(0);
  });
});
