import { addDays } from '@shared/calendar/dates';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, signal, untracked } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { debounceTime, merge } from 'rxjs';
import { messageOf } from '../core/api-error';
import { StudioContext } from '../core/studio-context';
import { formatShort, isoOfLocalDate, localDateOf } from '../calendar/calendar-dates';
import { lookOf } from '../calendar/calendar-kinds';
import { RunwaysApi, type RunwayAnchor, type RunwayPlanPreview, type TemplateChoice, type ThemeChoice, type UpcomingChoice } from './runways-api';

/** Opens the dialog for one theme (from the theme page) or without one (a theme is then picked in it). */
export interface PlanRunwayInput {
  themeId?: number;
  themeName?: string;
  /** The theme's target, to start the anchor from. */
  target?: { kind: string; value: string; date?: string | null } | null;
  offsetDays?: number;
  /** The theme's status: the tray only shows steps of picked and building themes. */
  themeStatus?: string;
}

const anchorKinds = ['date', 'occasion', 'holiday', 'market'] as const;

/** "Plan runway": a template, an anchor and an offset; previews the dated steps and warnings, then creates them. */
/**
 * Without a target, the anchor starts six weeks out: room for the longest built-in template (18 work
 * days and 3 cure days, about 4½ weeks of a five-day week), so a first plan can work instead of
 * opening "too short by 18 work days".
 */
const OPEN_ANCHOR_DAYS = 42;

@Component({
  selector: 'kc-plan-runway-dialog',
  imports: [
    ReactiveFormsModule,
    MatDialogModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatDatepickerModule,
    MatFormFieldModule,
    MatInputModule,
    MatProgressBarModule,
    MatRadioModule,
    MatSelectModule,
  ],
  templateUrl: './plan-runway-dialog.html',
  styleUrl: './plan-runway-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanRunwayDialog {
  protected readonly data = inject<PlanRunwayInput>(MAT_DIALOG_DATA, { optional: true }) ?? {};
  private readonly dialogRef = inject(MatDialogRef<PlanRunwayDialog>);
  private readonly api = inject(RunwaysApi);
  private readonly context = inject(StudioContext);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly lookOf = lookOf;
  protected readonly formatShort = formatShort;
  protected readonly anchorKinds = anchorKinds;

  protected readonly templates = httpResource<TemplateChoice[]>(() => `${this.context.base()}/runway-templates`);
  protected readonly upcoming = httpResource<UpcomingChoice[]>(() => `${this.context.base()}/occasions/upcoming`);
  protected readonly themes = httpResource<ThemeChoice[]>(() => (this.data.themeId ? undefined : `${this.context.base()}/themes`));

  protected readonly templateChoices = computed(() => (this.templates.hasValue() ? this.templates.value() : []));
  protected readonly themeChoices = computed(() => (this.themes.hasValue() ? this.themes.value() : []));

  private readonly initialKind = (anchorKinds as readonly string[]).includes(this.data.target?.kind ?? '')
    ? (this.data.target!.kind as RunwayAnchor['kind'])
    : 'date';

  protected readonly form = inject(NonNullableFormBuilder).group({
    themeId: [this.data.themeId ?? (null as number | null)],
    templateId: ['default' as number | 'default'],
    anchorKind: [this.initialKind],
    anchorDate: [localDateOf(this.initialKind === 'date' && this.data.target?.date ? this.data.target.date : addDays(this.context.today(), OPEN_ANCHOR_DAYS)) as Date | null],
    anchorValue: [this.initialKind !== 'date' ? (this.data.target?.value ?? '') : ''],
    offsetDays: [this.data.offsetDays ?? 0, [Validators.required, Validators.min(0), Validators.max(366)]],
    placement: ['calendar' as 'calendar' | 'tray'],
  });

  private readonly kind = toSignal(this.form.controls.anchorKind.valueChanges, { initialValue: this.form.controls.anchorKind.value });
  protected readonly anchorChoices = computed(() => (this.upcoming.hasValue() ? this.upcoming.value() : []).filter((choice) => choice.kind === this.kind()));
  private readonly placement = toSignal(this.form.controls.placement.valueChanges, { initialValue: this.form.controls.placement.value });
  private readonly chosenTheme = toSignal(this.form.controls.themeId.valueChanges, { initialValue: this.form.controls.themeId.value });
  /** Whether the steps would go to the tray of a theme that is not picked yet (the tray leaves those out). */
  protected readonly isHiddenInTray = computed(() => {
    if (this.placement() !== 'tray' || this.chosenTheme() === null) return false;
    const status = this.data.themeStatus ?? this.themeChoices().find((theme) => theme.id === this.chosenTheme())?.status;
    return status !== undefined && status !== 'picked' && status !== 'building';
  });
  protected readonly preview = signal<RunwayPlanPreview | null>(null);
  protected readonly previewError = signal<string | null>(null);
  protected readonly isPreviewing = signal(false);
  protected readonly isCreating = signal(false);
  private previewCount = 0;

  constructor() {
    const controls = this.form.controls;
    // Another kind of anchor: its first coming day, never the last kind's key (which the server refuses).
    const kindSwitch = controls.anchorKind.valueChanges.subscribe((kind) => {
      const first = (this.upcoming.hasValue() ? this.upcoming.value() : []).find((choice) => choice.kind === kind);
      controls.anchorValue.setValue(kind === 'date' ? '' : (first?.value ?? ''), { emitEvent: false });
    });
    // The theme's target names a key ("halloween"); the list offers dated choices ("halloween:2027-10-31").
    // Once the list is in, show the choice the preview is planned to instead of an empty field.
    effect(() => {
      const choices = this.anchorChoices();
      const value = untracked(() => controls.anchorValue.value);
      if (!value || choices.some((choice) => choice.value === value)) return;
      const target = this.data.target;
      const match = choices.find((choice) => choice.key === value && (!target?.date || choice.date === target.date)) ?? choices.find((choice) => choice.key === value);
      if (match) controls.anchorValue.setValue(match.value);
    });
    inject(DestroyRef).onDestroy(() => kindSwitch.unsubscribe());
    const subscription = merge(controls.templateId.valueChanges, controls.anchorKind.valueChanges, controls.anchorDate.valueChanges, controls.anchorValue.valueChanges, controls.offsetDays.valueChanges)
      .pipe(debounceTime(250))
      .subscribe(() => void this.refreshPreview());
    inject(DestroyRef).onDestroy(() => subscription.unsubscribe());
    void this.refreshPreview();
  }

  private anchor(): RunwayAnchor | null {
    const { anchorKind, anchorDate, anchorValue } = this.form.getRawValue();
    if (anchorKind === 'date') return anchorDate ? { kind: 'date', value: isoOfLocalDate(anchorDate) } : null;
    return anchorValue ? { kind: anchorKind, value: anchorValue } : null;
  }

  private request() {
    const anchor = this.anchor();
    const { offsetDays, templateId } = this.form.getRawValue();
    if (!anchor || this.form.controls.offsetDays.invalid) return null;
    return { anchor, offsetDays: Number(offsetDays), templateId };
  }

  protected async refreshPreview(): Promise<void> {
    const request = this.request();
    if (!request) {
      this.preview.set(null);
      return;
    }
    const ticket = ++this.previewCount;
    this.isPreviewing.set(true);
    try {
      const preview = await this.api.preview(request);
      if (ticket !== this.previewCount) return;
      this.preview.set(preview);
      this.previewError.set(null);
    } catch (error) {
      if (ticket !== this.previewCount) return;
      this.preview.set(null);
      this.previewError.set(messageOf(error));
    } finally {
      if (ticket === this.previewCount) this.isPreviewing.set(false);
    }
  }

  protected async create(): Promise<void> {
    const request = this.request();
    if (!request || this.isCreating()) return;
    this.isCreating.set(true);
    const { themeId, placement } = this.form.getRawValue();
    try {
      const created = await this.api.create({ ...request, themeId, placement });
      const where = placement === 'tray' ? 'in the tray' : 'on the calendar';
      // A runway planned to another day than its theme's target says so once it is made.
      const otherTarget = created.preview?.warnings.find((warning) => warning.code === 'other-target');
      this.snackBar.open(`Runway planned: its steps are ${where}.${otherTarget ? ` Note: ${otherTarget.message}.` : ''}`, undefined, { duration: otherTarget ? 8000 : 4000 });
      this.dialogRef.close(created);
    } catch (error) {
      this.previewError.set(messageOf(error));
    } finally {
      this.isCreating.set(false);
    }
  }

  protected kindLabel(kind: string): string {
    return kind === 'date' ? 'A date' : kind[0].toUpperCase() + kind.slice(1);
  }
}
