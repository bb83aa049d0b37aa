import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { ThemeCreate, ThemeDetail } from '@shared/contracts/themes';
import { StudioContext } from '../core/studio-context';

/** The board's writes; reads are httpResources in the components. */
@Injectable({ providedIn: 'root' })
export class TrendsApi {
  private readonly http = inject(HttpClient);
  private readonly context = inject(StudioContext);

  createTheme(input: ThemeCreate): Promise<ThemeDetail> {
    return firstValueFrom(this.http.post<ThemeDetail>(`${this.context.base()}/themes`, input));
  }
}
