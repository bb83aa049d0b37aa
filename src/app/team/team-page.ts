import { DatePipe } from '@angular/common';
import { HttpClient, httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal, viewChild } from '@angular/core';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { Router } from '@angular/router';
import { firstValueFrom, type Observable } from 'rxjs';
import { roles, type Role } from '@shared/contracts/auth';
import { invitationRequest, type InvitationView, type MemberView } from '@shared/contracts/team';
import { applyServerIssues, messageOf } from '../core/api-error';
import { SessionStore } from '../core/session-store';
import { StudioContext } from '../core/studio-context';
import { fieldError, zodValidator } from '../ui/zod-validator';
import { Confirmer } from '../ui/confirm-dialog';

export const roleHints: Record<Role, string> = {
  owner: 'Everything, including members, settings and feeds',
  partner: 'Plans and moves work, imports, edits runways, products and markets',
  crew: 'Reads everything, ticks off their own steps, has their own feed',
};

@Component({
  selector: 'kc-team-page',
  imports: [DatePipe, ReactiveFormsModule, MatTableModule, MatSelectModule, MatButtonModule, MatIconModule, MatFormFieldModule, MatInputModule],
  templateUrl: './team-page.html',
  styleUrl: './team-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TeamPage {
  private readonly http = inject(HttpClient);
  private readonly confirmer = inject(Confirmer);
  private readonly snackBar = inject(MatSnackBar);
  private readonly router = inject(Router);
  private readonly session = inject(SessionStore);
  protected readonly context = inject(StudioContext);
  protected readonly roles = roles;
  protected readonly roleHints = roleHints;
  protected readonly fieldError = fieldError;
  protected readonly columns = ['name', 'email', 'role', 'actions'];
  protected readonly isBusy = signal(false);
  protected readonly formError = signal<string | null>(null);

  protected readonly members = httpResource<MemberView[]>(() => (this.context.studioId() === null ? undefined : `${this.context.base()}/members`));
  protected readonly invitations = httpResource<InvitationView[]>(() =>
    this.context.studioId() === null || !this.context.isOwner() ? undefined : `${this.context.base()}/invitations`,
  );

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', zodValidator(invitationRequest.shape.email)],
    role: ['crew' as Role],
  });

  /** The invitation form's directive: resetting through it also clears "submitted", so the emptied field is not shown as an error. */
  private readonly inviteForm = viewChild(FormGroupDirective);

  /** The studio's UTC offset at an instant ("-0600"), for DatePipe, which takes offsets rather than zone names. */
  protected studioZoneOffset(iso: string): string {
    const zone = this.session.studios().find((studio) => studio.id === this.context.studioId())?.timezone;
    if (!zone) return '';
    const name = new Intl.DateTimeFormat('en-US', { timeZone: zone, timeZoneName: 'longOffset' }).formatToParts(new Date(iso)).find((part) => part.type === 'timeZoneName')?.value ?? 'GMT';
    const match = /GMT([+-])(\d{2}):(\d{2})/.exec(name);
    return match ? `${match[1]}${match[2]}${match[3]}` : '+0000';
  }

  protected async invite(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid || this.isBusy()) return;
    this.isBusy.set(true);
    this.formError.set(null);
    try {
      const sent = await firstValueFrom(this.http.post<InvitationView>(`${this.context.base()}/invitations`, this.form.getRawValue()));
      this.inviteForm()?.resetForm({ email: '', role: 'crew' });
      this.invitations.reload();
      this.snackBar.open(`Invitation sent to ${sent.email}`, undefined, { duration: 4000 });
    } catch (error) {
      this.formError.set(applyServerIssues(this.form, error));
    } finally {
      this.isBusy.set(false);
    }
  }

  protected async changeRole(member: MemberView, role: Role): Promise<void> {
    await this.act(this.http.patch(`${this.context.base()}/members/${member.userId}`, { role }), `${member.name} is now ${role}`);
    if (member.isYou) await this.refreshSession();
  }

  protected async remove(member: MemberView): Promise<void> {
    const question = member.isYou
      ? { title: 'Leave this studio?', message: 'You lose access to it at once.', action: 'Leave the studio' }
      : { title: `Remove ${member.name}?`, message: 'Their feeds of this studio stop at once.', action: 'Remove them' };
    if (!(await this.confirmer.ask(question))) return;
    const isDone = await this.act(this.http.delete(`${this.context.base()}/members/${member.userId}`), member.isYou ? 'You left the studio' : `${member.name} was removed`);
    if (isDone && member.isYou) {
      await this.refreshSession();
      await this.router.navigateByUrl('/');
    }
  }

  protected async revoke(invitation: InvitationView): Promise<void> {
    await this.act(this.http.delete(`${this.context.base()}/invitations/${invitation.id}`), `Invitation to ${invitation.email} revoked`);
    this.invitations.reload();
  }

  private async act(request: Observable<unknown>, done: string): Promise<boolean> {
    try {
      await firstValueFrom(request);
      this.snackBar.open(done, undefined, { duration: 3000 });
      return true;
    } catch (error) {
      this.snackBar.open(messageOf(error), 'Dismiss', { duration: 8000 });
      return false;
    } finally {
      this.members.reload();
    }
  }

  private async refreshSession(): Promise<void> {
    this.session.forget();
    await this.session.load();
  }
}
