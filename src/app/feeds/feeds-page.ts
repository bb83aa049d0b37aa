import { Clipboard } from '@angular/cdk/clipboard';
import { HttpClient, httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatSnackBar } from '@angular/material/snack-bar';
import QRCode from 'qrcode';
import { firstValueFrom } from 'rxjs';
import type { FeedScope, FeedView, NewFeed } from '@shared/contracts/feeds';
import { messageOf } from '../core/api-error';
import { StudioContext } from '../core/studio-context';
import { Confirmer } from '../ui/confirm-dialog';

export const scopeLabels: Record<FeedScope, string> = {
  all: 'All studio work',
  mine: 'Only my steps',
  markets: 'Only markets and deadlines',
};

/** A link just made or rotated: the one moment its URL is known, so it is kept only in memory. */
export interface FreshLink {
  feedId: number;
  url: string;
  webcal: string;
  qrDataUrl: string;
}

export function webcalOf(url: string): string {
  return url.replace(/^https?:\/\//, 'webcal://');
}

@Component({
  selector: 'kc-feeds-page',
  imports: [ReactiveFormsModule, MatCardModule, MatButtonModule, MatIconModule, MatFormFieldModule, MatSelectModule, MatSlideToggleModule],
  templateUrl: './feeds-page.html',
  styleUrl: './feeds-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FeedsPage {
  private readonly http = inject(HttpClient);
  private readonly confirmer = inject(Confirmer);
  private readonly snackBar = inject(MatSnackBar);
  private readonly clipboard = inject(Clipboard);
  protected readonly context = inject(StudioContext);
  protected readonly scopeLabels = scopeLabels;
  protected readonly scopes = Object.keys(scopeLabels) as FeedScope[];
  protected readonly isBusy = signal(false);
  protected readonly fresh = signal<FreshLink | null>(null);

  protected readonly feeds = httpResource<FeedView[]>(() => (this.context.studioId() === null ? undefined : `${this.context.base()}/feeds`));

  protected readonly form = inject(NonNullableFormBuilder).group({
    scope: ['mine' as FeedScope],
    includeHolidays: [false],
  });

  protected async create(): Promise<void> {
    await this.withLink(this.http.post<NewFeed>(`${this.context.base()}/feeds`, this.form.getRawValue()), 'Feed made: add it to your calendar app now');
  }

  protected async rotate(feed: FeedView): Promise<void> {
    if (!(await this.confirmer.ask({ title: 'Make a new link?', message: 'The old link stops working at once, on every device that uses it.', action: 'Make a new link' }))) return;
    await this.withLink(this.http.post<NewFeed>(`${this.context.base()}/feeds/${feed.id}/rotate`, {}), 'New link made; the old one no longer works');
  }

  protected async revoke(feed: FeedView): Promise<void> {
    if (!(await this.confirmer.ask({ title: 'Revoke this feed?', message: 'Calendars that use it stop updating.', action: 'Revoke the feed' }))) return;
    try {
      await firstValueFrom(this.http.delete(`${this.context.base()}/feeds/${feed.id}`));
      if (this.fresh()?.feedId === feed.id) this.fresh.set(null);
      this.snackBar.open('Feed revoked', undefined, { duration: 3000 });
    } catch (error) {
      this.snackBar.open(messageOf(error), 'Dismiss', { duration: 8000 });
    } finally {
      this.feeds.reload();
    }
  }

  protected copy(url: string): void {
    this.snackBar.open(this.clipboard.copy(url) ? 'Link copied' : 'Copy failed; select the link and copy it by hand', undefined, { duration: 3000 });
  }

  private async withLink(request: ReturnType<HttpClient['post']>, done: string): Promise<void> {
    if (this.isBusy()) return;
    this.isBusy.set(true);
    try {
      const feed = (await firstValueFrom(request)) as NewFeed;
      const qrDataUrl = await QRCode.toDataURL(feed.url, { margin: 1, width: 200, errorCorrectionLevel: 'M' });
      this.fresh.set({ feedId: feed.id, url: feed.url, webcal: webcalOf(feed.url), qrDataUrl });
      this.snackBar.open(done, undefined, { duration: 4000 });
    } catch (error) {
      this.snackBar.open(messageOf(error), 'Dismiss', { duration: 8000 });
    } finally {
      this.isBusy.set(false);
      this.feeds.reload();
    }
  }
}
