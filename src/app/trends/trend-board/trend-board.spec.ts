import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { SeriesSummary } from '@shared/contracts/series';
import { scoreSeries } from '@shared/scoring/score-series';
import { boardRow, setUpBoard as setUp } from '../trends-testing';

const weekly = (level: number) => Array.from({ length: 120 }, (_, t) => ({ date: new Date(Date.UTC(2024, 0, 1 + 7 * t)).toISOString().slice(0, 10), value: level + 10 * Math.sin(t / 8) }));

function row(id: number, term: string, level: number): SeriesSummary {
  return boardRow(id, term, scoreSeries(weekly(level), { period: 'weekly', today: '2026-05-01' }));
}

const terms = async (table: MatTableHarness) => (await table.getCellTextByColumnName())['term'].text.map((text) => text.replace(/ ?interest · weekly$/, ''));

// Harness clicks wait for the table to settle after each answer; a few seconds each under jsdom.
jest.setTimeout(30_000);

describe('TrendBoard', () => {
  it('when a column header is clicked, then the server is asked for that sort and the table shows its answer', async () => {
    const { loader, queries } = await setUp([row(1, 'pumpkin sign', 40), row(2, 'herb rack', 20), row(3, 'lantern', 30)]);
    expect(queries.at(-1)?.get('sort')).toBe('heat');
    expect(queries.at(-1)?.get('order')).toBe('desc');
    const table = await loader.getHarness(MatTableHarness);
    const heats = (await table.getCellTextByColumnName())['heat'].text.map(Number);
    expect(heats).toEqual([...heats].sort((a, b) => b - a));

    const sort = await loader.getHarness(MatSortHarness);
    const [termHeader] = await sort.getSortHeaders({ label: 'Term or item' });
    await termHeader.click();
    expect(queries.at(-1)?.get('sort')).toBe('term');
    expect(queries.at(-1)?.get('order')).toBe('asc');
    expect(queries.at(-1)?.get('page')).toBe('1');
    expect(await termHeader.getSortDirection()).toBe('asc');
    expect(await terms(table)).toEqual(['herb rack', 'lantern', 'pumpkin sign']);

    await termHeader.click();
    expect(queries.at(-1)?.get('order')).toBe('desc');
    expect(await terms(table)).toEqual(['pumpkin sign', 'lantern', 'herb rack']);
    expect(await (await sort.getActiveHeader())?.getLabel()).toBe('Term or item');
  });

  it('when the next page is asked for, then the server is asked for page 2 of the same sort', async () => {
    const rows = [row(1, 'pumpkin sign', 40)];
    const { loader, queries } = await setUp(rows, 60);
    const table = await loader.getHarness(MatTableHarness);
    expect((await table.getCellTextByColumnName())['heat'].text).toEqual([rows[0].score!.heat.toFixed(0)]);
    const paginator = await loader.getHarness(MatPaginatorHarness);
    await paginator.goToNextPage();
    expect(queries.at(-1)?.get('page')).toBe('2');
    expect(queries.at(-1)?.get('pageSize')).toBe('25');
    expect(queries.at(-1)?.get('sort')).toBe('heat');
  });
});
