import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatDividerModule } from '@angular/material/divider';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatToolbarModule } from '@angular/material/toolbar';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { Auth } from './core/auth';
import { WorkspaceContext } from './core/workspace-context';
import { AboutDialog } from './features/about/about-dialog';
import { ChangePasswordDialog } from './features/account/change-password-dialog';

interface NavItem {
  label: string;
  icon: string;
  /** Path under the current workspace, or null for the workspace list. */
  path: string | null;
}

/** The shell: top bar with the navigation and the signed-in user, and the routed page below. */
@Component({
  selector: 'osm-root',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatToolbarModule, MatButtonModule, MatIconModule, MatMenuModule, MatDividerModule, MatTooltipModule],
  templateUrl: './app.html',
  styleUrl: './app.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class App {
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  protected readonly auth = inject(Auth);
  protected readonly workspaces = inject(WorkspaceContext);

  protected readonly nav: NavItem[] = [
    { label: 'Workspaces', icon: 'apps', path: null },
    { label: 'Designs', icon: 'schema', path: 'designs' },
    { label: 'Library', icon: 'science', path: 'library' },
    { label: 'Members', icon: 'group', path: 'members' },
    { label: 'Activity', icon: 'history', path: 'activity' },
  ];

  protected readonly workspaceId = computed(() => this.workspaces.current()?.id ?? null);

  constructor() {
    void this.auth.restore();
  }

  protected link(item: NavItem): string[] | null {
    if (item.path === null) return ['/workspaces'];
    const wid = this.workspaceId();
    return wid === null ? null : ['/workspaces', String(wid), item.path];
  }

  protected openAbout(): void {
    this.dialog.open(AboutDialog, { width: '420px' });
  }

  protected changePassword(): void {
    this.dialog.open(ChangePasswordDialog, { width: '400px' });
  }

  protected signOut(): void {
    this.auth.signOut().subscribe({
      complete: () => {
        this.workspaces.reset();
        void this.router.navigate(['/sign-in']);
      },
    });
  }
}
