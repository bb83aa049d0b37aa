import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { PlanWarningView, StepKind } from '@shared/contracts/calendar';
import { StudioContext } from '../core/studio-context';

/** What a runway is planned back from; `value` is a date, or a key from GET /occasions/upcoming. */
export interface RunwayAnchor {
  kind: 'date' | 'holiday' | 'occasion' | 'market';
  value: string;
}

export interface RunwayPlanRequest {
  anchor: RunwayAnchor;
  offsetDays: number;
  templateId: number | 'default';
}

export interface RunwayPlanPreview {
  launch: string;
  start: string;
  steps: { name: string; kind: StepKind; start: string; end: string; cautions?: string[] }[];
  warnings: PlanWarningView[];
}

export interface TemplateChoice {
  id: number | 'default';
  name: string;
}

export interface UpcomingChoice {
  kind: 'holiday' | 'occasion' | 'market';
  /** "key:YYYY-MM-DD": the key and this coming day. */
  value: string;
  /** The holiday's or occasion's key, or the market's id, as a theme's target names it. */
  key: string;
  name: string;
  date: string;
}

export interface ThemeChoice {
  id: number;
  name: string;
  status: string;
}

/** The runway endpoints the plan dialog uses. */
@Injectable({ providedIn: 'root' })
export class RunwaysApi {
  private readonly http = inject(HttpClient);
  private readonly context = inject(StudioContext);

  private body(request: RunwayPlanRequest) {
    const anchor = request.anchor.kind === 'date' ? { anchorDate: request.anchor.value } : { anchor: request.anchor };
    return { ...anchor, offsetDays: request.offsetDays, templateId: request.templateId };
  }

  preview(request: RunwayPlanRequest): Promise<RunwayPlanPreview> {
    return firstValueFrom(this.http.post<RunwayPlanPreview>(`${this.context.base()}/runways/preview`, this.body(request)));
  }

  create(request: RunwayPlanRequest & { themeId: number | null; placement: 'calendar' | 'tray' }): Promise<{ id: number; preview?: { warnings: { code: string; message: string }[] } }> {
    return firstValueFrom(
      this.http.post<{ id: number; preview?: { warnings: { code: string; message: string }[] } }>(`${this.context.base()}/runways`, {
        ...this.body(request),
        themeId: request.themeId,
        placement: request.placement,
      }),
    );
  }
}
