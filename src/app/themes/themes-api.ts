import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { ThemeCreate, ThemeDetail, ThemePatch, ThemePick, ThemeStatusChange } from '@shared/contracts/themes';
import { StudioContext } from '../core/studio-context';

/** Theme writes; each answers the theme as stored, with its new version. */
@Injectable({ providedIn: 'root' })
export class ThemesApi {
  private readonly http = inject(HttpClient);
  private readonly context = inject(StudioContext);
  private url(themeId?: number): string {
    return themeId === undefined ? `${this.context.base()}/themes` : `${this.context.base()}/themes/${themeId}`;
  }

  create(input: ThemeCreate): Promise<ThemeDetail> {
    return firstValueFrom(this.http.post<ThemeDetail>(this.url(), input));
  }

  update(themeId: number, patch: ThemePatch): Promise<ThemeDetail> {
    return firstValueFrom(this.http.patch<ThemeDetail>(this.url(themeId), patch));
  }

  changeStatus(themeId: number, change: ThemeStatusChange): Promise<ThemeDetail> {
    return firstValueFrom(this.http.post<ThemeDetail>(`${this.url(themeId)}/status`, change));
  }

  pick(themeId: number, pick: ThemePick): Promise<ThemeDetail> {
    return firstValueFrom(this.http.post<ThemeDetail>(`${this.url(themeId)}/pick`, pick));
  }

  remove(themeId: number): Promise<void> {
    return firstValueFrom(this.http.delete<void>(this.url(themeId)));
  }
}
