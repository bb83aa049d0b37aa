import { MatSnackBar } from '@angular/material/snack-bar';
import { BreakpointObserver } from '@angular/cdk/layout';
import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, signal, untracked } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatChipsModule } from '@angular/material/chips';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatTooltipModule } from '@angular/material/tooltip';
import { ActivatedRoute, Router } from '@angular/router';
import { firstValueFrom, map } from 'rxjs';
import { addDays, isIsoDate } from '@shared/calendar/dates';
import type { EventKind } from '@shared/contracts/calendar';
import type { ThemeView } from '@shared/contracts/themes';
import { messageOf } from '../../core/api-error';
import { SessionStore } from '../../core/session-store';
import { StudioContext } from '../../core/studio-context';
import { PlanRunwayDialog, type PlanRunwayInput } from '../../runways/plan-runway-dialog';
import { AgendaList } from '../agenda-list/agenda-list';
import { formatMonth, formatShort, initialsOf, isoOfLocalDate, localDateOf } from '../calendar-dates';
import { isBand, kindLooks } from '../calendar-kinds';
import { CalendarStore } from '../calendar-store';
import { CalendarTray } from '../calendar-tray/calendar-tray';
import { EventSheet } from '../event-sheet/event-sheet';
import { MonthView } from '../month-view/month-view';
import { MoveFlow } from '../move-flow';
import { WeekView } from '../week-view/week-view';

/** How often the calendar asks whether another member changed something. */
export const pollIntervalMs = 10_000;

/**
 * How long the month may take to load before the loading bar shows: a quick answer then fills the
 * grid without a bar flashing on and off (whose animation would also be drawn every frame meanwhile).
 */
export const loadingBarDelayMs = 400;

@Component({
  selector: 'kc-calendar-page',
  imports: [
    MatButtonModule,
    MatButtonToggleModule,
    MatChipsModule,
    MatDatepickerModule,
    MatIconModule,
    MatProgressBarModule,
    MatSidenavModule,
    MatTooltipModule,
    MonthView,
    WeekView,
    AgendaList,
    CalendarTray,
    EventSheet,
  ],
  templateUrl: './calendar-page.html',
  styleUrl: './calendar-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CalendarPage {
  protected readonly store = inject(CalendarStore);
  protected readonly flow = inject(MoveFlow);
  protected readonly context = inject(StudioContext);
  private readonly dialog = inject(MatDialog);
  private readonly http = inject(HttpClient);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  /** ?planTheme=<id>: the theme page's "Plan runway" opens the dialog here, for that theme. */
  private readonly planTheme = toSignal(this.route.queryParamMap.pipe(map((params) => params.get('planTheme'))), { initialValue: null });
  /**
   * ?date=YYYY-MM-DD opens the calendar on that day (the weekly agenda mail and the home page's work
   * list link so), and &event=<id> opens that event's side sheet too.
   */
  private readonly openAt = toSignal(this.route.queryParamMap.pipe(map((params) => ({ date: params.get('date'), event: params.get('event') }))), {
    initialValue: { date: null, event: null },
  });
  protected readonly kindLooks = kindLooks;
  protected readonly isBand = isBand;
  /** The signed-in member's initials, for the legend's sample of an assigned step. */
  private readonly session = inject(SessionStore);
  protected readonly myInitials = computed(() => initialsOf(this.session.user()?.name) || null);

  protected readonly isPhone = toSignal(
    inject(BreakpointObserver)
      .observe('(max-width: 800px)')
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  protected readonly title = computed(() => {
    const days = this.store.days();
    if (this.store.view() === 'month') return formatMonth(this.store.focus());
    return `${formatShort(days[0])} – ${formatShort(days[days.length - 1])}`;
  });
  protected readonly focusDate = computed(() => localDateOf(this.store.focus()));
  /** Whether the events have been loading for longer than loadingBarDelayMs. */
  protected readonly isLoadingSlowly = signal(false);
  /** Whether a first month has come in (or failed to), or one was already loaded when the page opened. */
  private readonly hasFirstMonth = signal(false);
  /**
   * Whether the page is kept unseen while its first month loads, until the loading bar shows
   * (loadingBarDelayMs). A quick answer then comes on screen as one frame of grid and
   * steps. Painted empty first, the grid was still being rasterised (tens of milliseconds of CPU in a
   * software-drawn browser) while the steps were drawn into it, and was rasterised again with them.
   * Unseen is opacity 0 (calendar-page.scss): laid out but not rasterised, and showing it restyles one
   * element, where visibility (inherited) restyled the whole page inside the measured render.
   */
  protected readonly isFirstLoadUnseen = computed(() => !this.hasFirstMonth() && !this.isLoadingSlowly());
  protected readonly loadError = computed(() => {
    const error = this.store.events.error() ?? this.store.tray.error();
    return error ? messageOf(error) : null;
  });

  constructor() {
    effect(() => this.store.setPhoneWidth(this.isPhone()));
    // A month already loaded (the page opened again) shows at once, while it refreshes.
    effect(() => {
      if (!this.store.events.isLoading() || this.store.events.hasValue()) this.hasFirstMonth.set(true);
    });
    effect((onCleanup) => {
      if (!this.store.events.isLoading()) return this.isLoadingSlowly.set(false);
      const timer = setTimeout(() => this.isLoadingSlowly.set(true), loadingBarDelayMs);
      onCleanup(() => clearTimeout(timer));
    });
    effect(() => {
      this.context.studioId();
      untracked(() => this.flow.close());
    });
    // A move's message (a refusal above all) is about the days it was shown with: it goes when the
    // view moves on to other days or another view.
    const snackBar = inject(MatSnackBar);
    let shownDays: string | null = null;
    effect(() => {
      const days = `${this.store.view()}|${this.store.days()[0]}`;
      if (shownDays !== null && days !== shownDays) untracked(() => snackBar.dismiss());
      shownDays = days;
    });
    effect(() => {
      const { date, event } = this.openAt();
      if (!date && !event) return;
      untracked(() => {
        if (date && isIsoDate(date)) this.store.goTo(date);
        if (event) this.flow.selectedId.set(event);
        void this.router.navigate([], { relativeTo: this.route, queryParams: { date: null, event: null }, queryParamsHandling: 'merge', replaceUrl: true });
      });
    });
    effect(() => {
      const themeId = this.planTheme();
      if (themeId && this.store.canEdit()) untracked(() => void this.planRunwayFor(Number(themeId)));
    });
    const timer = setInterval(() => void this.store.checkForChanges().catch(() => undefined), pollIntervalMs);
    void this.store.checkForChanges().catch(() => undefined);
    inject(DestroyRef).onDestroy(() => clearInterval(timer));
  }

  protected jumpTo(date: Date | null): void {
    if (date) this.store.goTo(isoOfLocalDate(date));
  }

  protected isShown(kind: EventKind): boolean {
    return !this.store.hiddenKinds().has(kind);
  }

  private async planRunwayFor(themeId: number): Promise<void> {
    void this.router.navigate([], { relativeTo: this.route, queryParams: { planTheme: null }, queryParamsHandling: 'merge', replaceUrl: true });
    const theme = await firstValueFrom(this.http.get<ThemeView>(`${this.context.base()}/themes/${themeId}`)).catch(() => null);
    if (!theme) return;
    const target = theme.target;
    this.planRunway({
      themeId: theme.id,
      themeName: theme.name,
      themeStatus: theme.status,
      offsetDays: theme.offsetDays,
      // A month or date target plans back from its day; occasions and holidays by their key.
      target: target ? (target.kind === 'month' || target.kind === 'date' ? { kind: 'date', value: target.date ?? '', date: target.date } : { kind: target.kind, value: target.value, date: target.date }) : null,
    });
  }

  protected planRunway(data: PlanRunwayInput = {}): void {
    this.dialog
      .open(PlanRunwayDialog, { data, width: '640px', maxWidth: '96vw' })
      .afterClosed()
      .subscribe((created) => {
        if (created) this.store.refresh();
      });
  }

  /** The phone agenda's heading: "This week" from today, else its 8 days ("Dec 14 – Dec 21"). */
  protected agendaTitle(): string {
    const first = this.store.days()[0];
    if (!first || first === this.store.today()) return 'This week';
    return `${formatShort(first)} – ${formatShort(addDays(first, 7))}`;
  }

  protected nextWeekLabel(): string {
    return `${formatShort(this.store.today())} – ${formatShort(addDays(this.store.today(), 7))}`;
  }
}
