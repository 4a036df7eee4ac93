import { Clipboard } from '@angular/cdk/clipboard';
import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { catchError, filter, of } from 'rxjs';
import { UserRole, roleLabel } from '../../auth/roles';
import { keyEffectsSummary } from '../key-effects';
import { SessionService } from '../../auth/session.service';
import { formatDateTime, formatRelative } from '../../format/format';
import { errorMessage } from '../../problem/http-problem';
import { ConfirmDialog, ConfirmDialogData } from '../../ui/confirm-dialog/confirm-dialog';
import { InviteDialog } from '../invite-dialog/invite-dialog';
import { OutboxPanel } from '../outbox/outbox-panel';
import { ConsoleUser, InvitationResult, OutboxMessage, UserChanges } from '../user.model';
import { UsersService } from '../users.service';

@Component({
  selector: 'iso-users-page',
  imports: [
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatProgressBarModule,
    MatSelectModule,
    MatTableModule,
    MatTooltipModule,
    OutboxPanel,
  ],
  templateUrl: './users-page.html',
  styleUrl: './users-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UsersPage {
  private readonly users = inject(UsersService);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly me = inject(SessionService).user;

  private readonly usersResource = rxResource({ stream: () => this.users.listAll() });
  /** The outbox exists only in development; a 404 means production and hides the section. */
  private readonly outboxResource = rxResource({
    stream: () =>
      this.users.outbox().pipe(
        catchError((error: unknown) => {
          if (error instanceof HttpErrorResponse && error.status === 404) return of(null);
          throw error;
        }),
      ),
  });

  protected readonly list = signal<ConsoleUser[] | null>(null);
  protected readonly rows = computed(
    () => this.list() ?? (this.usersResource.hasValue() ? this.usersResource.value() : []),
  );
  protected readonly loading = this.usersResource.isLoading;
  protected readonly error = computed(() => {
    const error = this.usersResource.error();
    return error ? errorMessage(error) : null;
  });
  protected readonly outbox = computed<OutboxMessage[] | null>(() =>
    this.outboxResource.hasValue() ? this.outboxResource.value() : null,
  );
  protected readonly outboxError = computed(() => {
    const error = this.outboxResource.error();
    return error ? errorMessage(error) : null;
  });

  protected readonly columns = ['user', 'role', 'status', 'lastSignIn', 'actions'];
  protected readonly roles: UserRole[] = ['admin', 'developer', 'viewer'];
  protected readonly roleLabel = roleLabel;
  protected readonly formatRelative = formatRelative;
  protected readonly formatDateTime = formatDateTime;
  protected readonly now = new Date();
  protected readonly unsentLink = signal<{ email: string; url: string } | null>(null);
  private readonly clipboard = inject(Clipboard);

  protected reload(): void {
    this.list.set(null);
    this.usersResource.reload();
    this.outboxResource.reload();
  }

  protected openInvite(): void {
    this.dialog
      .open(InviteDialog, { width: '480px', maxWidth: '94vw' })
      .afterClosed()
      .pipe(filter((result): result is InvitationResult => Boolean(result)))
      .subscribe((result) => this.invited(result.user, result.invitation));
  }

  /** Users whose new invitation link is being made (the button waits for the answer). */
  protected readonly reissuing = signal<ReadonlySet<string>>(new Set());

  /**
   * A new one-time link for someone who has not accepted yet, after confirmation: the earlier link
   * stops working, so the admin should know before the person finds it dead.
   */
  protected reissue(user: ConsoleUser): void {
    const data: ConfirmDialogData = {
      title: `Send ${user.email} a new invitation?`,
      message:
        'They get a new one-time link to set their password. The link sent before stops working, so an e-mail they already have is of no use.',
      confirmLabel: 'Send new link',
    };
    this.dialog
      .open(ConfirmDialog, { data, maxWidth: '94vw' })
      .afterClosed()
      .pipe(filter((confirmed) => confirmed === true))
      .subscribe(() => {
        this.setReissuing(user.id, true);
        this.users.reissueInvitation(user.id).subscribe({
          next: (result) => {
            this.setReissuing(user.id, false);
            this.invited(result.user, result.invitation, 'A new invitation');
          },
          error: (error: unknown) => {
            this.setReissuing(user.id, false);
            this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 10000 });
            // A 409 means they accepted or were disabled meanwhile: show what the server holds now.
            this.reload();
          },
        });
      });
  }

  private setReissuing(id: string, busy: boolean): void {
    this.reissuing.update((ids) => {
      const next = new Set(ids);
      if (busy) next.add(id);
      else next.delete(id);
      return next;
    });
  }

  protected copyLink(url: string): void {
    if (this.clipboard.copy(url)) this.snackBar.open('Link copied.', undefined, { duration: 2500 });
  }

  private invited(user: ConsoleUser, invitation: InvitationResult['invitation'], what = 'Invitation'): void {
    this.replace(user, true);
    // When the mail could not go out, the admin hands the link over another way.
    this.unsentLink.set(invitation.emailSent ? null : { email: user.email, url: invitation.url });
    const text = invitation.emailSent
      ? `${what} sent to ${user.email}, valid until ${formatDateTime(invitation.expiresAt)}.`
      : `The e-mail to ${user.email} could not be sent; copy the link below.`;
    this.snackBar.open(text, undefined, { duration: 5000 });
    this.outboxResource.reload();
  }

  protected changeRole(user: ConsoleUser, role: UserRole): void {
    if (role === user.role) return;
    this.apply(user, { role }, `${user.email} is now ${roleLabel(role).toLowerCase()}.`);
  }

  protected toggleDisabled(user: ConsoleUser): void {
    if (user.status === 'disabled') {
      this.apply(user, { status: 'active' }, `${user.email} can sign in again.`);
      return;
    }
    const data: ConfirmDialogData = {
      title: `Disable ${user.email}?`,
      message:
        'They are signed out and cannot sign in until enabled again. Their API keys are refused until then too.',
      confirmLabel: 'Disable user',
      destructive: true,
    };
    this.dialog
      .open(ConfirmDialog, { data, maxWidth: '94vw' })
      .afterClosed()
      .pipe(filter((confirmed) => confirmed === true))
      .subscribe(() => this.apply(user, { status: 'disabled' }, `${user.email} is disabled.`));
  }

  private apply(user: ConsoleUser, changes: UserChanges, done: string): void {
    this.users.update(user.id, changes).subscribe({
      next: (updated) => {
        const { keys, ...changed } = updated;
        this.replace({ ...user, ...changed });
        const effects = keyEffectsSummary(keys);
        this.snackBar.open(effects ? `${done} ${effects}` : done, effects ? 'Dismiss' : undefined, {
          duration: effects ? 10000 : 4000,
        });
      },
      error: (error: unknown) => {
        // Put the select back to what the server still holds.
        this.replace({ ...user });
        this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 10000 });
      },
    });
  }

  private replace(user: ConsoleUser, prepend = false): void {
    const current = this.rows();
    const exists = current.some((existing) => existing.id === user.id);
    this.list.set(
      exists
        ? current.map((existing) => (existing.id === user.id ? user : existing))
        : prepend
          ? [user, ...current]
          : [...current, user],
    );
  }
}
