import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { UserRole, roleLabel } from '../../auth/roles';
import { errorMessage } from '../../problem/http-problem';
import { LIMITS, NAME_MAX_LENGTH } from '../../../../../shared/limits';
import { InvitationResult } from '../user.model';
import { UsersService } from '../users.service';

const ROLE_HINTS: Record<UserRole, string> = {
  admin: 'Everything: keys, usage and users of everyone.',
  developer: 'Rooms, measurements and tunings; own keys, own usage and the playground.',
  viewer: 'Reads usage and the docs; changes nothing.',
};

@Component({
  selector: 'iso-invite-dialog',
  imports: [
    MatButtonModule,
    MatDialogModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    ReactiveFormsModule,
  ],
  template: `
    <h2 mat-dialog-title>Invite someone</h2>
    <form [formGroup]="form" (ngSubmit)="send()" novalidate>
      <mat-dialog-content class="fields">
        <p class="lead">They get an e-mail with a one-time link to set their password.</p>
        @if (error(); as message) {
          <div class="iso-alert" role="alert">
            <mat-icon aria-hidden="true">error</mat-icon><span>{{ message }}</span>
          </div>
        }
        <mat-form-field>
          <mat-label>E-mail</mat-label>
          <input matInput type="email" formControlName="email" required data-testid="invite-email" />
          @if (form.controls.email.invalid) {
            <mat-error>Enter an e-mail address.</mat-error>
          }
        </mat-form-field>
        <mat-form-field>
          <mat-label>Name (optional)</mat-label>
          <input matInput formControlName="name" [maxlength]="maxName" />
        </mat-form-field>
        <mat-form-field>
          <mat-label>Role</mat-label>
          <mat-select formControlName="role" data-testid="invite-role">
            @for (role of roles; track role) {
              <mat-option [value]="role">{{ roleLabel(role) }}</mat-option>
            }
          </mat-select>
          <mat-hint>{{ hints[form.controls.role.value] }}</mat-hint>
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="busy()" data-testid="send-invite">
          Send invitation
        </button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .fields {
      display: grid;
      gap: 14px;
    }
    .lead {
      margin: 0;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InviteDialog {
  private readonly users = inject(UsersService);
  private readonly dialogRef = inject<MatDialogRef<InviteDialog, InvitationResult>>(MatDialogRef);
  protected readonly roles: UserRole[] = ['viewer', 'developer', 'admin'];
  protected readonly hints = ROLE_HINTS;
  protected readonly roleLabel = roleLabel;
  protected readonly maxName = NAME_MAX_LENGTH;
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: [
      '',
      [Validators.required, Validators.email, Validators.maxLength(LIMITS['inviteUser.email'].maxLength)],
    ],
    name: ['', Validators.maxLength(NAME_MAX_LENGTH)],
    role: ['developer' as UserRole, Validators.required],
  });

  protected send(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { email, name, role } = this.form.getRawValue();
    this.busy.set(true);
    this.error.set(null);
    this.users
      .invite({ email: email.trim(), role, ...(name.trim() ? { name: name.trim() } : {}) })
      .subscribe({
        next: (result) => this.dialogRef.close(result),
        error: (error: unknown) => {
          this.busy.set(false);
          this.error.set(errorMessage(error));
        },
      });
  }
}
