import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { MatIconModule } from '@angular/material/icon';
import { MatButtonModule } from '@angular/material/button';
import { MatMenuModule } from '@angular/material/menu';
import { MatTooltipModule } from '@angular/material/tooltip';
import { AbilityServiceSignal } from '@casl/angular';
import type { AppAbility } from '../../../../shared/authz/app-ability';
import { ROLE_LABELS } from '../../../../shared/authz/roles';
import { SessionStore } from '../auth/session-store';
import { LogoMark } from '../../ui/logo-mark';
import { NAV_ITEMS } from './nav-items';

@Component({
  selector: 'tt-shell',
  imports: [
    RouterOutlet,
    RouterLink,
    RouterLinkActive,
    MatIconModule,
    MatButtonModule,
    MatMenuModule,
    MatTooltipModule,
    LogoMark,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class Shell {
  private readonly session = inject(SessionStore);
  private readonly router = inject(Router);
  private readonly ability = inject<AbilityServiceSignal<AppAbility>>(AbilityServiceSignal);

  /** The phone layout hides the menu behind a button; it closes again once a page is chosen. */
  protected readonly menuOpen = signal(false);
  protected readonly user = this.session.user;
  protected readonly organisation = this.session.organisation;
  protected readonly roleLabels = computed(() => (this.user()?.roles ?? []).map((r) => ROLE_LABELS[r]));
  protected readonly initials = computed(() =>
    (this.user()?.displayName ?? '?')
      .split(/\s+/)
      .map((p) => p[0])
      .slice(0, 2)
      .join('')
      .toUpperCase(),
  );
  protected readonly navItems = computed(() =>
    NAV_ITEMS.filter((item) => !item.needs || this.ability.can(item.needs[0], item.needs[1])),
  );

  protected async signOut(): Promise<void> {
    await this.session.signOut();
    await this.router.navigate(['/sign-in']);
  }
}
