import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDividerModule } from '@angular/material/divider';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatMenuModule } from '@angular/material/menu';
import { MatSidenav, MatSidenavModule } from '@angular/material/sidenav';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatToolbarModule } from '@angular/material/toolbar';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';
import { roleLabel } from '../auth/roles';
import { SessionService } from '../auth/session.service';
import { errorMessage } from '../problem/http-problem';
import { ThemeMode, ThemeService } from '../theme/theme.service';
import { NAV_ITEMS } from './nav-items';

@Component({
  selector: 'iso-shell',
  imports: [
    MatButtonModule,
    MatDividerModule,
    MatIconModule,
    MatListModule,
    MatMenuModule,
    MatSidenavModule,
    MatToolbarModule,
    MatTooltipModule,
    RouterLink,
    RouterLinkActive,
    RouterOutlet,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  private readonly session = inject(SessionService);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly theme = inject(ThemeService);
  private readonly sidenav = viewChild(MatSidenav);

  protected readonly user = this.session.user;
  protected readonly wide = toSignal(
    inject(BreakpointObserver)
      .observe('(min-width: 960px)')
      .pipe(map((state) => state.matches)),
    { initialValue: true },
  );
  protected readonly navItems = computed(() =>
    NAV_ITEMS.filter((item) => !item.needs || this.session.can(item.needs)),
  );
  protected readonly roleLabel = computed(() => roleLabel(this.session.role() ?? ''));
  protected readonly initials = computed(() => {
    const user = this.user();
    const source = user?.name?.trim() || user?.email || '?';
    return source
      .split(/[\s@.]+/)
      .filter(Boolean)
      .slice(0, 2)
      .map((part) => part[0]?.toUpperCase())
      .join('');
  });
  protected readonly themeIcon = computed(() => {
    const icons: Record<ThemeMode, string> = { system: 'contrast', light: 'light_mode', dark: 'dark_mode' };
    return icons[this.theme.mode()];
  });

  /** With <base href="/"> a bare #fragment link would load the overview; focus the content instead. */
  protected skipToContent(event: Event): void {
    event.preventDefault();
    document.getElementById('main-content')?.focus();
  }

  protected setTheme(mode: ThemeMode): void {
    this.theme.mode.set(mode);
  }

  protected closeIfNarrow(): void {
    if (!this.wide()) void this.sidenav()?.close();
  }

  protected signOut(): void {
    this.session.signOut().subscribe({
      next: () => void this.router.navigate(['/sign-in']),
      error: (error: unknown) => this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 8000 }),
    });
  }
}
