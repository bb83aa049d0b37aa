import { inject, Injectable } from '@angular/core';
import { DateAdapter, MAT_DATE_FORMATS, MAT_NATIVE_DATE_FORMATS, NativeDateAdapter } from '@angular/material/core';
import { localDateOf } from '../calendar/calendar-dates';
import { StudioContext } from './studio-context';

/** The Material datepicker's adapter, whose "today" (marked and opened on) is the studio's, not the browser's. */
@Injectable()
export class StudioDateAdapter extends NativeDateAdapter {
  private readonly context = inject(StudioContext);

  override today(): Date {
    return localDateOf(this.context.today());
  }
}

/** In place of provideNativeDateAdapter(): the same formats, the studio's today. */
export function provideStudioDateAdapter() {
  return [
    { provide: DateAdapter, useClass: StudioDateAdapter },
    { provide: MAT_DATE_FORMATS, useValue: MAT_NATIVE_DATE_FORMATS },
  ];
}
