import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { CalendarEvent, EventsStamp, MoveResult, ReplanResult } from '@shared/contracts/calendar';
import { StudioContext } from '../core/studio-context';

export interface MoveRequest {
  /** null puts the step back in the tray. */
  start: string | null;
  end: string | null;
  version: number;
  /** Whether to store the move even though it breaks a rule. */
  force?: boolean;
}

export interface DetailsPatch {
  title?: string;
  notes?: string | null;
  assigneeId?: number | null;
  version: number;
}

/** The calendar's writes (reads are httpResources in CalendarStore). */
@Injectable({ providedIn: 'root' })
export class CalendarApi {
  private readonly http = inject(HttpClient);
  private readonly context = inject(StudioContext);

  private eventUrl(eventId: string): string {
    return `${this.context.base()}/events/${encodeURIComponent(eventId)}`;
  }

  move(eventId: string, request: MoveRequest): Promise<MoveResult> {
    return firstValueFrom(this.http.patch<MoveResult>(this.eventUrl(eventId), request));
  }

  async updateDetails(eventId: string, patch: DetailsPatch | { done: boolean; version: number }): Promise<CalendarEvent> {
    const answer = await firstValueFrom(this.http.patch<MoveResult | CalendarEvent>(this.eventUrl(eventId), patch));
    return 'event' in answer ? answer.event : answer;
  }

  /** `fromItself`: the step moves too (one that breaks a rule now), from its predecessor on. */
  replan(eventId: string, isPreview: boolean, fromItself = false): Promise<ReplanResult> {
    const query = [isPreview ? 'preview=1' : '', fromItself ? 'from=itself' : ''].filter(Boolean).join('&');
    const url = `${this.eventUrl(eventId)}/replan${query ? `?${query}` : ''}`;
    return firstValueFrom(this.http.post<ReplanResult>(url, {}));
  }

  stamp(): Promise<EventsStamp> {
    return firstValueFrom(this.http.get<EventsStamp>(`${this.context.base()}/events/stamp`));
  }
}
