import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';
import { AuthStore } from '../auth/auth-store';
import { LogoMark } from './logo-mark';

interface NavLink {
  path: string;
  label: string;
  icon: string;
}

/** Below this width the navigation floats over the page instead of taking a column. */
const COMPACT_QUERY = '(max-width: 720px)';

@Component({
  selector: 'rm-shell',
  imports: [
    RouterOutlet,
    RouterLink,
    RouterLinkActive,
    MatToolbarModule,
    MatSidenavModule,
    MatListModule,
    MatIconModule,
    MatButtonModule,
    MatTooltipModule,
    LogoMark,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  private readonly auth = inject(AuthStore);
  private readonly router = inject(Router);

  protected readonly user = this.auth.user;
  protected readonly roleLabel = this.auth.roleLabel;
  protected readonly compact = toSignal(
    inject(BreakpointObserver)
      .observe(COMPACT_QUERY)
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  /** Open by default on wide screens, closed on phones; reset whenever the layout flips. */
  protected readonly navOpen = linkedSignal(() => !this.compact());

  protected readonly links = computed<NavLink[]>(() => {
    const can = this.auth.capabilities();
    const links: NavLink[] = [
      { path: '/portfolio', label: 'Portfolio', icon: 'dashboard' },
      { path: '/sites', label: 'Sites', icon: 'yard' },
      { path: '/weather-stations', label: 'Weather', icon: 'partly_cloudy_day' },
    ];
    // Auditors read only: the server refuses their uploads, so the menu doesn't offer them.
    if (this.auth.user()?.organisation.role !== 'auditor')
      links.push({ path: '/uploads', label: 'Uploads', icon: 'upload_file' });
    const role = this.auth.user()?.organisation.role;
    // Closing a month is the owning organisation's managers' work.
    if (role === 'admin' || role === 'manager')
      links.push({ path: '/month-close', label: 'Month close', icon: 'fact_check' });
    links.push({ path: '/reports', label: 'Reports', icon: 'insights' });
    links.push({ path: '/etaf', label: 'Achieved ETAF', icon: 'water_drop' });
    // Conservation work: the agency's officers (auditors), managers and administrators; the server says the same.
    if (this.auth.user()?.organisation.role !== 'contractor')
      links.push({ path: '/watering-rules', label: 'Watering rules', icon: 'gavel' });
    links.push({ path: '/alerts', label: 'Alerts', icon: 'notifications_active' });
    if (can.manageUsers) links.push({ path: '/admin/users', label: 'Users', icon: 'group' });
    if (can.viewOutbox) links.push({ path: '/admin/outbox', label: 'Outbox', icon: 'outgoing_mail' });
    // Everyone has a settings page: units (read-only unless admin) and their own alert e-mail.
    links.push({ path: '/settings', label: 'Settings', icon: 'settings' });
    return links;
  });

  protected toggleNav(): void {
    this.navOpen.update((open) => !open);
  }

  protected closeNavOnPhone(): void {
    if (this.compact()) this.navOpen.set(false);
  }

  protected async signOut(): Promise<void> {
    await this.auth.signOut().catch(() => undefined);
    await this.router.navigate(['/sign-in']);
  }
}
