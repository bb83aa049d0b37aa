import { LiveAnnouncer } from '@angular/cdk/a11y';
import { inject, Injectable, signal } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import { MatSnackBar } from '@angular/material/snack-bar';
import { firstValueFrom } from 'rxjs';
import { addDays, daysBetween, type IsoDate } from '@shared/calendar/dates';
import type { CalendarEvent, TrayStep } from '@shared/contracts/calendar';
import { messageOf } from '../core/api-error';
import { formatLong } from './calendar-dates';
import { CalendarStore, type MoveOutcome } from './calendar-store';
import { MoveToDialog, type MoveToData } from './move-to-dialog';
import { ReplanDialog, type ReplanDialogData } from './replan-dialog';

export type Movable = CalendarEvent | TrayStep;

/** What a dragged chip carries: the step and the day cell it was dragged from (null from the tray). */
export interface DragData {
  item: Movable;
  day: IsoDate | null;
}

/** A drop list: a month's or week's days (the day is the one under the pointer), or the tray. */
export type DropTarget = 'days' | 'tray';

/** A chip let go over a drop list (chip-drags.ts): where, from which list, and what it carried. */
export interface ChipDrop {
  target: DropTarget;
  source: DropTarget;
  data: DragData;
  dropPoint: { x: number; y: number };
}

/** The day cell (data-date) under a point of the page, if any. */
export function dayAt(point: { x: number; y: number }): IsoDate | null {
  const cell = document.elementFromPoint(point.x, point.y)?.closest<HTMLElement>('[data-date]');
  const date = cell?.dataset['date'];
  return date && date !== 'tray' ? date : null;
}

/** Moves by mouse, keyboard or dialog, and tells the user what happened: snack bars and the live announcer. */
@Injectable({ providedIn: 'root' })
export class MoveFlow {
  private readonly store = inject(CalendarStore);
  private readonly snackBar = inject(MatSnackBar);
  private readonly dialog = inject(MatDialog);
  private readonly announcer = inject(LiveAnnouncer);

  /** The step being moved with the arrow keys and the day it would go to. */
  readonly keyboardTarget = signal<{ id: string; date: IsoDate } | null>(null);
  readonly selectedId = signal<string | null>(null);

  canDrag(item: Movable): boolean {
    return item.editable && this.store.canEdit();
  }

  async dropped(drop: ChipDrop): Promise<void> {
    const { item, day } = drop.data;
    if (drop.target === 'tray') {
      if (drop.source !== 'tray' && item.start !== null) await this.backToTray(item as CalendarEvent);
      return;
    }
    const target = dayAt(drop.dropPoint);
    // Back on the day it came from (or off the days): nothing to send.
    if (target === null || target === day) return;
    // A chip of a several-day step keeps the distance between the grabbed day and the step's start.
    const start = item.start === null || day === null ? target : addDays(item.start, daysBetween(day, target));
    await this.moveTo(item, start);
  }

  async moveTo(item: Movable, start: IsoDate, options: { force?: boolean; version?: number } = {}): Promise<MoveOutcome | null> {
    if (start === item.start && !options.force) return null;
    const outcome = await this.store.move(item, start, options);
    this.report(item, start, outcome);
    return outcome;
  }

  /** Drops a step back into the tray. */
  async backToTray(event: CalendarEvent): Promise<void> {
    const outcome = await this.store.unschedule(event);
    const message = outcome.status === 'moved' ? `${event.title} is back in the tray.` : outcome.message.replace('Not moved', 'Not put back');
    void this.announcer.announce(message, outcome.status === 'moved' ? 'polite' : 'assertive');
    this.snackBar.open(message, outcome.status === 'moved' ? undefined : 'Dismiss', { duration: outcome.status === 'moved' ? 4000 : 8000 });
  }

  private report(item: Movable, start: IsoDate, outcome: MoveOutcome): void {
    if (outcome.status === 'moved') {
      const warned = outcome.warnings.map((warning) => warning.message).join(' ');
      const message = `Moved ${item.title} to ${formatLong(outcome.event.start)}.${warned ? ` ${warned}` : ''}`;
      void this.announcer.announce(message);
      if (outcome.event.runwayId == null) {
        this.snackBar.open(message, undefined, { duration: 4000 });
        return;
      }
      this.snackBar
        .open(message, 'Shift the following steps', { duration: 10_000 })
        .onAction()
        .subscribe(() => void this.offerReplan(outcome.event));
      return;
    }
    void this.announcer.announce(outcome.message, 'assertive');
    if (outcome.status === 'failed') {
      this.snackBar.open(outcome.message, 'Dismiss', { duration: 8000 });
      return;
    }
    const retry = outcome.status === 'conflict' && outcome.current ? outcome.current : item;
    this.snackBar
      .open(outcome.message, 'Move anyway', { duration: 15_000 })
      .onAction()
      .subscribe(() => void this.moveTo(retry, start, { force: true, version: retry.version }));
  }

  /**
   * Shows which of the following steps would move, and moves them when the user agrees; with
   * `fromItself`, the step itself too (it breaks a rule where it is).
   */
  async offerReplan(event: CalendarEvent, fromItself = false): Promise<void> {
    try {
      const preview = await this.store.previewReplan(event.id, fromItself);
      if (preview.moves.length === 0) {
        this.snackBar.open('The following steps still fit; nothing needs to shift.', undefined, { duration: 4000 });
        return;
      }
      const data: ReplanDialogData = { title: event.title, preview };
      const isConfirmed = await firstValueFrom(this.dialog.open(ReplanDialog, { data, width: '520px' }).afterClosed());
      if (!isConfirmed) return;
      const result = await this.store.applyReplan(event.id, fromItself);
      const message = `Shifted ${result.moves.length}${fromItself ? '' : ' following'} step${result.moves.length === 1 ? '' : 's'}.`;
      void this.announcer.announce(message);
      this.snackBar.open(message, undefined, { duration: 4000 });
    } catch (error) {
      this.snackBar.open(`Could not shift the following steps: ${messageOf(error)}`, 'Dismiss', { duration: 8000 });
    }
  }

  /** The "Move to…" path: a date picker dialog. */
  async chooseDate(item: Movable): Promise<void> {
    const data: MoveToData = { title: item.title, start: item.start ?? this.store.focus() };
    const date = await firstValueFrom(this.dialog.open(MoveToDialog, { data }).afterClosed());
    if (date) await this.moveTo(item, date);
  }

  /**
   * A key pressed on a chip: arrow keys pick a day (±1 day, ±1 week), Enter moves there, Escape
   * cancels, each step announced; M opens "Move to…". Decides at once whether the key was used, so
   * that its default (a scroll, or the button's click on Enter) can still be prevented, and leaves the
   * move or the dialog running.
   */
  keyPressed(item: Movable, key: string): boolean {
    const shift: Record<string, number> = { ArrowLeft: -1, ArrowRight: 1, ArrowUp: -7, ArrowDown: 7 };
    const pending = this.keyboardTarget();
    const isPending = pending?.id === item.id;
    if (key in shift) {
      if (!this.canDrag(item)) return false;
      const from = isPending ? pending.date : (item.start ?? this.store.focus());
      const date = addDays(from, shift[key]);
      this.keyboardTarget.set({ id: item.id, date });
      void this.announcer.announce(`Move ${item.title} to ${formatLong(date)}? Press Enter to move, Escape to cancel.`);
      return true;
    }
    if (key === 'Enter' && isPending) {
      this.keyboardTarget.set(null);
      void this.moveTo(item, pending.date);
      return true;
    }
    if (key === 'Escape' && isPending) {
      this.keyboardTarget.set(null);
      void this.announcer.announce(`${item.title} stays where it was.`);
      return true;
    }
    if ((key === 'm' || key === 'M') && this.canDrag(item)) {
      void this.chooseDate(item);
      return true;
    }
    return false;
  }

  open(item: Movable): void {
    this.selectedId.set(item.id);
  }

  close(): void {
    this.selectedId.set(null);
  }
}
