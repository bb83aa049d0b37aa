// Issue 23 on the board: each verdict agrees with the figures shown beside it (a property test over
// generated series, read from the rendered cells), a series without enough history shows no heat
// but what it still needs, and every column explains itself on hover and on focus.
import { MatTableHarness } from '@angular/material/table/testing';
import { MatTooltipHarness } from '@angular/material/tooltip/testing';
import fc from 'fast-check';
import { scoreSeries } from '@shared/scoring/score-series';
import { scoreOfShape, seriesShape } from '../../../../tests/fixtures/scoring/series-shapes';
import { boardRow, setUpBoard } from '../trends-testing';
import { columnHints } from './board-columns';

jest.setTimeout(60_000);

/** The signed number of a cell such as "+37 % a year" or "−12 %", as a fraction; null without one. */
function percentIn(text: string): number | null {
  const match = /([+\-−]?\d+(?:\.\d+)?)\s*%/.exec(text);
  return match ? Number(match[1].replace('−', '-')) / 100 : null;
}

const numberIn = (text: string): number | null => (/\d/.test(text) ? Number(/-?\d+(\.\d+)?/.exec(text)![0]) : null);

describe('TrendBoard figures', () => {
  it('when generated series are on the board, then every verdict agrees with the rise and strength beside it', async () => {
    // Thresholds from docs/decisions/0002 (ours): rising/fading ±10 % a year, seasonal F ≥ 0.6
    // unless growth reaches ±25 % a year.
    const shapes = fc.sample(seriesShape, { numRuns: 80, seed: 2023 });
    const rows = shapes.map((shape, index) => boardRow(index + 1, `term ${index + 1}`, scoreOfShape(shape), shape.isMonthly ? 'monthly' : 'weekly', shape.kind));
    const { loader } = await setUpBoard(rows);
    const cells = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    const complaints: string[] = [];
    cells['verdict'].text.forEach((verdict, index) => {
      const riseCell = cells['rise'].text[index];
      const rise = percentIn(riseCell);
      const strength = numberIn(cells['strength'].text[index]);
      const heat = cells['heat'].text[index];
      const say = (isWrong: boolean) => isWrong && complaints.push(`${verdict} beside rise "${riseCell}", strength ${strength}, heat "${heat}"`);
      if (verdict === 'Rising') say(rise === null || rise < 0.1);
      if (verdict === 'Fading') say(rise === null || rise > -0.1);
      if (verdict === 'Steady') say((rise !== null && Math.abs(rise) >= 0.1) || (strength !== null && strength >= 0.6));
      if (verdict === 'Seasonal') say(strength === null || strength < 0.6 || (rise !== null && Math.abs(rise) >= 0.25));
      if (verdict === 'Not enough history') say(rise !== null || !/needs \d+ more/.test(heat) || /^\s*\d/.test(heat));
    });
    expect(complaints).toEqual([]);
    // The sample holds every kind of verdict, so each rule above was tried.
    expect(new Set(cells['verdict'].text)).toEqual(new Set(['Rising', 'Fading', 'Steady', 'Seasonal', 'Spike', 'Not enough history']));
  });

  it('when a series has too little history, then it shows no heat but what more it needs, after the scored ones', async () => {
    const weeks = (count: number) => Array.from({ length: count }, (_, t) => ({ date: new Date(Date.UTC(2024, 0, 1 + 7 * t)).toISOString().slice(0, 10), value: 20 + 5 * Math.sin(t / 6) }));
    const short = boardRow(1, 'new lamp shade', scoreSeries(weeks(8), { period: 'weekly', today: '2026-05-01' }));
    const scored = boardRow(2, 'herb rack', scoreSeries(weeks(120), { period: 'weekly', today: '2026-05-01' }));
    const { loader, fixture } = await setUpBoard([short, scored]);
    const cells = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(cells['heat'].text).toEqual([scored.score!.heat!.toFixed(0), '–needs 5 more weeks']);
    expect(cells['rise'].text[1]).toBe('–');
    expect(fixture.nativeElement.textContent).toContain('Series with too little history have no heat yet');
  });

  it('when a column header is hovered or focused, then it explains its column', async () => {
    const { loader, fixture } = await setUpBoard([boardRow(1, 'herb rack', scoreSeries([], { period: 'weekly', today: '2026-05-01' }))]);
    const columns = ['select', 'term', 'heat', 'verdict', 'spark', 'rise', 'strength', 'nextPeak', 'region', 'covered'];
    const element = fixture.nativeElement as HTMLElement;
    expect([...element.querySelectorAll('th.mat-mdc-header-cell')].map((th) => /mat-column-(\w+)/.exec(th.className)![1])).toEqual(columns);
    for (const column of columns) {
      const hint = await loader.getHarness(MatTooltipHarness.with({ selector: `th.mat-column-${column}` }));
      await hint.show();
      expect([column, await hint.getTooltipText()]).toEqual([column, columnHints[column]]);
      await hint.hide();
      // Keyboard: a Tab key moves focus to the header's focusable part (a sort header's inner
      // button, or the label).
      const focusable = element.querySelector<HTMLElement>(`th.mat-column-${column} [tabindex="0"]`)!;
      document.body.dispatchEvent(new KeyboardEvent('keydown', { key: 'Tab', bubbles: true }));
      focusable.focus();
      await fixture.whenStable();
      expect([column, await hint.isOpen()]).toEqual([column, true]);
      focusable.blur();
      await fixture.whenStable();
    }
  });
});
