import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { TestBed } from '@angular/core/testing';
import { MatStepperHarness } from '@angular/material/stepper/testing';
import { provideRouter } from '@angular/router';
import { of } from 'rxjs';
import type { ImportPreview } from '@shared/contracts/imports';
import { ImportsApi, type UploadEvent } from '../imports-api';
import { ImportWizard } from './import-wizard';

function salesPreview(returnRows: number): ImportPreview {
  return {
    id: 7,
    status: 'preview',
    fileName: 'sales.csv',
    dateOrder: null,
    hasErrors: false,
    byteSize: 120,
    sha256: 'a'.repeat(64),
    duplicateOf: null,
    kind: 'sales',
    layout: 'sales',
    delimiter: ',',
    decimalSeparator: '.',
    headerRow: 1,
    period: 'daily',
    dateFormat: 'YYYY-MM-DD',
    dateAmbiguous: false,
    columns: [
      { index: 0, name: 'date', role: 'date' },
      { index: 1, name: 'item', role: 'item' },
      { index: 2, name: 'quantity', role: 'quantity' },
      { index: 3, name: 'revenue', role: 'revenue' },
    ],
    mapping: { date: 'date', item: 'item', quantity: 'quantity', revenue: 'revenue' },
    rows: 4,
    returnRows,
    sample: [['2025-06-01', 'Oak tray', '-1', '-10.00']],
    problems: [],
  };
}

async function checkStep(returnRows: number) {
  const upload = () => of<UploadEvent>({ kind: 'done', preview: salesPreview(returnRows) });
  TestBed.configureTestingModule({
    imports: [ImportWizard],
    providers: [provideHttpClient(), provideRouter([]), { provide: ImportsApi, useValue: { upload } }],
  });
  const fixture = TestBed.createComponent(ImportWizard);
  fixture.componentRef.setInput('file', new File(['date,item,quantity,revenue'], 'sales.csv'));
  await fixture.whenStable();
  const stepper = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatStepperHarness);
  await stepper.selectStep({ label: 'Check' });
  await fixture.whenStable();
  return fixture.nativeElement.querySelector('[data-testid=returns]')?.textContent?.trim() ?? null;
}

describe('ImportWizard check step', () => {
  it('when the preview has 3 return rows, then the check step says so', async () => {
    expect(await checkStep(3)).toBe('undo 3 rows are returns (negative quantity); they are stored as negative sales.');
  });

  it('when the preview has one return row, then the line speaks of one row', async () => {
    expect(await checkStep(1)).toContain('1 row is a return (negative quantity)');
  });

  it('when the preview has no return rows, then no line is shown', async () => {
    expect(await checkStep(0)).toBeNull();
  });
});
