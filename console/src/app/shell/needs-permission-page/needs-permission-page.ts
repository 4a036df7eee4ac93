import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { PERMISSION_WORDS, Permission, roleLabel } from '../../auth/roles';
import { SessionService } from '../../auth/session.service';

/** Where a link leads to a page the signed-in user may not open: what it needs, and what to do. */
@Component({
  selector: 'iso-needs-permission-page',
  imports: [MatButtonModule, MatIconModule, RouterLink],
  template: `
    <h1 class="iso-page-title">This page needs another role</h1>
    <p class="iso-page-lead" data-testid="needs-permission">
      @if (words(); as w) {
        {{ page() || 'This page' }} is for people who may {{ w.what }}: the {{ w.roles }} role. You are signed
        in as {{ role() }}.
      } @else {
        You are signed in as {{ role() }}, which does not include this page.
      }
      An admin can change your role on the Users page.
    </p>
    <a mat-flat-button routerLink="/">Back to the overview</a>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NeedsPermissionPage {
  private readonly session = inject(SessionService);
  readonly needs = input<string>();
  readonly page = input<string>();
  protected readonly words = computed(() => {
    const needs = this.needs();
    return needs && needs in PERMISSION_WORDS ? PERMISSION_WORDS[needs as Permission] : null;
  });
  protected readonly role = computed(() => roleLabel(this.session.role() ?? 'unknown'));
}
