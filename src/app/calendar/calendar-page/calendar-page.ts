import { BreakpointObserver } from '@angular/cdk/layout';
import { CdkDropListGroup } from '@angular/cdk/drag-drop';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, untracked } from '@angular/core';
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
import { map } from 'rxjs';
import { addDays } from '@shared/calendar/dates';
import type { EventKind } from '@shared/contracts/calendar';
import { messageOf } from '../../core/api-error';
import { StudioContext } from '../../core/studio-context';
import { PlanRunwayDialog, type PlanRunwayInput } from '../../runways/plan-runway-dialog';
import { AgendaList } from '../agenda-list/agenda-list';
import { formatMonth, formatShort, isoOfLocalDate, localDateOf } from '../calendar-dates';
import { kindLooks } from '../calendar-kinds';
import { CalendarStore } from '../calendar-store';
import { CalendarTray } from '../calendar-tray/calendar-tray';
import { EventSheet } from '../event-sheet/event-sheet';
import { MonthView } from '../month-view/month-view';
import { MoveFlow } from '../move-flow';
import { WeekView } from '../week-view/week-view';

/** How often the calendar asks whether another member changed something. */
export const pollIntervalMs = 10_000;

@Component({
  selector: 'kc-calendar-page',
  imports: [
    CdkDropListGroup,
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
  protected readonly kindLooks = kindLooks;

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
  protected readonly loadError = computed(() => {
    const error = this.store.events.error() ?? this.store.tray.error();
    return error ? messageOf(error) : null;
  });

  constructor() {
    effect(() => this.store.setPhoneWidth(this.isPhone()));
    effect(() => {
      this.context.studioId();
      untracked(() => {
        this.store.resetStamp();
        this.flow.close();
      });
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

  protected planRunway(): void {
    const data: PlanRunwayInput = {};
    this.dialog
      .open(PlanRunwayDialog, { data, width: '640px', maxWidth: '96vw' })
      .afterClosed()
      .subscribe((created) => {
        if (created) this.store.refresh();
      });
  }

  protected nextWeekLabel(): string {
    return `${formatShort(this.store.today())} – ${formatShort(addDays(this.store.today(), 7))}`;
  }
}
