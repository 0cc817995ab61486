import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { AuthStore } from '../../core/auth/auth-store';

interface Section {
  path: string;
  label: string;
  icon: string;
}

/**
 * The settings frame: a tab per section the user may open, the section below. Each section names itself with
 * its own heading, so embedded pages (alert e-mail, users) read the same here as on their old addresses.
 */
@Component({
  selector: 'rm-settings-page',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatTabsModule, MatIconModule],
  template: `
    <div class="rm-page settings">
      <nav mat-tab-nav-bar mat-stretch-tabs="false" [tabPanel]="panel" aria-label="Settings" class="sections">
        @for (s of sections(); track s.path) {
          <a mat-tab-link [routerLink]="s.path" routerLinkActive #rla="routerLinkActive" [active]="rla.isActive">
            <mat-icon aria-hidden="true">{{ s.icon }}</mat-icon>
            <span class="tab-label">{{ s.label }}</span>
          </a>
        }
      </nav>
      <mat-tab-nav-panel #panel class="panel">
        <router-outlet />
      </mat-tab-nav-panel>
    </div>
  `,
  styles: `
    .sections {
      margin-bottom: 20px;
      --mat-tab-divider-color: var(--mat-sys-outline-variant);
    }
    a[mat-tab-link] {
      min-width: 0;
      padding: 0 16px;
    }
    mat-icon {
      margin-right: 8px;
    }
    @media (max-width: 600px) {
      a[mat-tab-link] {
        padding: 0 10px;
      }
      mat-icon {
        display: none;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SettingsPage {
  private readonly auth = inject(AuthStore);

  protected readonly sections = computed<Section[]>(() => {
    const can = this.auth.capabilities();
    const sections: Section[] = [
      { path: 'units', label: 'Units', icon: 'straighten' },
      { path: 'notifications', label: 'Notifications', icon: 'mail' },
    ];
    if (can.manageSettings) sections.push({ path: 'api-keys', label: 'API keys', icon: 'key' });
    if (can.manageUsers) sections.push({ path: 'users', label: 'Users', icon: 'group' });
    return sections;
  });
}
