import { DatePipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { DomSanitizer } from '@angular/platform-browser';
import type { CapturedMail } from '@shared/contracts/team';
import { valueOr } from '../core/resource-value';

/**
 * The mail the local SMTP fake caught (development only; the API answers 404 in production). HTML
 * is shown in a sandboxed iframe with no scripts, forms or same-origin access, under the app's CSP
 * (no remote images).
 */
@Component({
  selector: 'kc-mailbox-page',
  imports: [DatePipe, MatListModule, MatButtonModule, MatButtonToggleModule, MatIconModule],
  templateUrl: './mailbox-page.html',
  styleUrl: './mailbox-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MailboxPage {
  private readonly sanitizer = inject(DomSanitizer);
  protected readonly mails = httpResource<CapturedMail[]>(() => '/api/dev/mailbox');
  protected readonly selectedId = signal<number | null>(null);
  protected readonly view = signal<'html' | 'text'>('text');
  protected readonly selected = computed<CapturedMail | null>(() => {
    const list = valueOr(this.mails, []);
    return list.find((mail) => mail.id === this.selectedId()) ?? list[0] ?? null;
  });
  /** The text part with its http(s) links made clickable (the HTML frame cannot open app pages). */
  protected readonly textParts = computed(() => {
    const text = this.selected()?.text ?? '';
    return text.split(/(https?:\/\/[^\s<>"]+)/).map((part, index) => ({ text: part, isLink: index % 2 === 1 }));
  });
  // Safe to trust here only because the frame is sandboxed without allow-scripts or allow-same-origin.
  protected readonly frameHtml = computed(() => {
    const mail = this.selected();
    return mail ? this.sanitizer.bypassSecurityTrustHtml(mail.html || `<pre>${mail.text.replace(/[&<>]/g, (c) => `&#${c.charCodeAt(0)};`)}</pre>`) : null;
  });
}
