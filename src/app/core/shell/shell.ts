import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatMenuModule } from '@angular/material/menu';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';
import { SessionStore } from '../session-store';
import { StudioContext } from '../studio-context';
import { navItems } from './nav-items';

@Component({
  selector: 'kc-shell',
  imports: [
    RouterOutlet,
    RouterLink,
    RouterLinkActive,
    MatToolbarModule,
    MatSidenavModule,
    MatListModule,
    MatIconModule,
    MatButtonModule,
    MatMenuModule,
    MatTooltipModule,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  private readonly router = inject(Router);
  protected readonly session = inject(SessionStore);
  protected readonly context = inject(StudioContext);

  readonly studioId = input.required<string>();

  protected readonly isPhone = toSignal(
    inject(BreakpointObserver)
      .observe('(max-width: 800px)')
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  protected readonly currentStudio = computed(() => this.session.studios().find((s) => s.id === Number(this.studioId())) ?? null);
  protected readonly items = computed(() => {
    const role = this.context.role();
    return navItems.filter((item) => !item.roles || (role !== null && item.roles.includes(role)));
  });

  constructor() {
    effect(() => this.context.select(Number(this.studioId())));
  }

  protected switchTo(studioId: number): void {
    void this.router.navigate(['/studios', studioId]);
  }

  protected async signOut(): Promise<void> {
    await this.session.signOut();
    await this.router.navigate(['/sign-in']);
  }
}
