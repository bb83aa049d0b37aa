import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, effect, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatChipsModule, type MatChipInputEvent } from '@angular/material/chips';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatSnackBar } from '@angular/material/snack-bar';
import { firstValueFrom } from 'rxjs';
import { studioSettingsPatch, type StudioSettings } from '@shared/contracts/studios';
import { defaultChannels } from '@shared/csv/csv-channels';
import { applyServerIssues } from '../core/api-error';
import { valueOr } from '../core/resource-value';
import { StudioContext } from '../core/studio-context';
import { fieldError, zodValidator } from '../ui/zod-validator';

const weekdays = [
  { value: 1, label: 'Mon' },
  { value: 2, label: 'Tue' },
  { value: 3, label: 'Wed' },
  { value: 4, label: 'Thu' },
  { value: 5, label: 'Fri' },
  { value: 6, label: 'Sat' },
  { value: 7, label: 'Sun' },
];

@Component({
  selector: 'kc-studio-settings',
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatSlideToggleModule,
    MatChipsModule,
    MatIconModule,
  ],
  templateUrl: './studio-settings.html',
  styleUrl: './studio-settings.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StudioSettingsPage {
  private readonly http = inject(HttpClient);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly context = inject(StudioContext);
  protected readonly weekdays = weekdays;
  protected readonly timezones = Intl.supportedValuesOf('timeZone');
  protected readonly fieldError = fieldError;
  protected readonly isBusy = signal(false);
  protected readonly formError = signal<string | null>(null);
  private version = 1;

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', zodValidator(studioSettingsPatch.shape.name)],
    timezone: [''],
    country: ['US', zodValidator(studioSettingsPatch.shape.country)],
    region: [''],
    weekStart: [1 as 1 | 7],
    workDays: [[1, 2, 3, 4, 5] as number[]],
    dailyCapacityHours: [8, zodValidator(studioSettingsPatch.shape.dailyCapacityHours)],
    holidaysOff: [true],
    channels: [[...defaultChannels] as string[], zodValidator(studioSettingsPatch.shape.channels)],
  });

  constructor() {
    effect(() => {
      const settings = valueOr(this.context.settings, undefined);
      if (settings) this.fill(settings);
    });
    // Only owners change the studio's settings; others read them in a form that looks read-only.
    effect(() => {
      if (this.context.role() === null || this.context.isOwner()) this.form.enable({ emitEvent: false });
      else this.form.disable({ emitEvent: false });
    });
  }

  protected addChannel(event: MatChipInputEvent): void {
    const name = event.value.trim();
    const channels = this.form.controls.channels;
    if (name) channels.setValue([...channels.value, name]);
    channels.markAsTouched();
    event.chipInput.clear();
  }

  protected removeChannel(name: string): void {
    const channels = this.form.controls.channels;
    channels.setValue(channels.value.filter((channel) => channel !== name));
    channels.markAsTouched();
  }

  private fill(settings: StudioSettings): void {
    this.version = settings.version;
    this.form.reset({ ...settings, region: settings.region ?? '' });
  }

  protected async save(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid || this.isBusy()) return;
    this.isBusy.set(true);
    this.formError.set(null);
    const value = this.form.getRawValue();
    try {
      const saved = await firstValueFrom(
        this.http.patch<StudioSettings>(this.context.base(), {
          ...value,
          country: value.country.toUpperCase(),
          region: value.region ? value.region.toUpperCase() : null,
          dailyCapacityHours: Number(value.dailyCapacityHours),
          version: this.version,
        }),
      );
      this.fill(saved);
      this.context.settings.set(saved);
      this.snackBar.open('Studio settings saved', undefined, { duration: 3000 });
    } catch (error) {
      this.formError.set(applyServerIssues(this.form, error));
    } finally {
      this.isBusy.set(false);
    }
  }
}
