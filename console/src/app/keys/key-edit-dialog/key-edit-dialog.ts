import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { SessionService } from '../../auth/session.service';
import { errorMessage } from '../../problem/http-problem';
import { notBlank } from '../../tunings/tuning-details-dialog';
import { LIMITS, NAME_MAX_LENGTH } from '../../../../../shared/limits';
import { formatCount } from '../../format/format';
import { endOfLocalDay, maskedKey } from '../key-format';
import { ApiKey, KeyChanges } from '../key.model';
import { KeysService } from '../keys.service';

/** Renames a key, changes its rate limit (admins) or its expiry; returns the updated key. */
@Component({
  selector: 'iso-key-edit-dialog',
  imports: [
    MatButtonModule,
    MatDatepickerModule,
    MatDialogModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    ReactiveFormsModule,
  ],
  template: `
    <h2 mat-dialog-title>Edit “{{ key.name }}”</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="fields">
        <p class="masked">
          Key <code>{{ masked }}</code>
        </p>
        @if (error(); as message) {
          <div class="iso-alert" role="alert">
            <mat-icon aria-hidden="true">error</mat-icon><span>{{ message }}</span>
          </div>
        }
        <mat-form-field>
          <mat-label>Name</mat-label>
          <input matInput formControlName="name" [maxlength]="maxName" required data-testid="edit-key-name" />
          @if (form.controls.name.hasError('required')) {
            <mat-error>Give the key a name.</mat-error>
          }
        </mat-form-field>
        <mat-form-field>
          <mat-label>Requests per minute</mat-label>
          <input
            matInput
            type="number"
            [min]="rateLimit.minimum"
            [max]="rateLimit.maximum"
            formControlName="rateLimitPerMinute"
            data-testid="edit-rate-limit"
          />
          <mat-hint>{{
            canSetRateLimit ? 'Empty uses the default.' : 'Only an admin changes rate limits.'
          }}</mat-hint>
          @if (form.controls.rateLimitPerMinute.invalid) {
            <mat-error>{{ rateLimitRange }}</mat-error>
          }
        </mat-form-field>
        <mat-form-field>
          <mat-label>Expires on</mat-label>
          <input
            matInput
            [matDatepicker]="picker"
            [max]="latestExpiry"
            formControlName="expires"
            data-testid="edit-expiry"
          />
          <mat-datepicker-toggle matIconSuffix [for]="picker" />
          <mat-datepicker #picker />
          <mat-hint>{{ expiryHint }}</mat-hint>
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="busy() || form.pristine">Save</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .fields {
      display: grid;
      gap: 14px;
      min-width: min(380px, 70vw);
    }
    .masked {
      margin: 0;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class KeyEditDialog {
  protected readonly key = inject<ApiKey>(MAT_DIALOG_DATA);
  private readonly keys = inject(KeysService);
  private readonly dialogRef = inject<MatDialogRef<KeyEditDialog, ApiKey>>(MatDialogRef);
  protected readonly canSetRateLimit = inject(SessionService).can('keys:setRateLimit');
  protected readonly masked = maskedKey(this.key);
  protected readonly maxName = NAME_MAX_LENGTH;
  protected readonly rateLimit = LIMITS.KeyRateLimit;
  protected readonly rateLimitRange = `Between ${formatCount(LIMITS.KeyRateLimit.minimum)} and ${formatCount(LIMITS.KeyRateLimit.maximum)}.`;
  private readonly expired = this.key.status === 'expired';
  /** Only an admin moves an expiry later or removes it; an owner may only bring it nearer. */
  protected readonly latestExpiry =
    this.canSetRateLimit || !this.key.expiresAt ? null : new Date(this.key.expiresAt);
  protected readonly expiryHint = this.expired
    ? 'This key has expired and stays expired; create a new key.'
    : this.canSetRateLimit
      ? 'Empty means it never expires.'
      : this.key.expiresAt
        ? 'You may bring the expiry nearer; only an admin moves it later or removes it.'
        : 'Empty means it never expires. Once set, only an admin moves it later or removes it.';
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [this.key.name, [Validators.required, notBlank, Validators.maxLength(NAME_MAX_LENGTH)]],
    rateLimitPerMinute: [
      { value: this.key.rateLimitPerMinute, disabled: !this.canSetRateLimit },
      [Validators.min(LIMITS.KeyRateLimit.minimum), Validators.max(LIMITS.KeyRateLimit.maximum)],
    ],
    expires: [
      {
        value: this.key.expiresAt ? new Date(this.key.expiresAt) : (null as Date | null),
        disabled: this.expired,
      },
    ],
  });

  protected save(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const controls = this.form.controls;
    const changes: KeyChanges = {};
    if (controls.name.dirty) changes.name = controls.name.value.trim();
    if (this.canSetRateLimit && controls.rateLimitPerMinute.dirty) {
      const limit = controls.rateLimitPerMinute.value;
      changes.rateLimitPerMinute = limit === null || String(limit) === '' ? null : Number(limit);
    }
    if (controls.expires.enabled && controls.expires.dirty)
      changes.expiresAt = controls.expires.value ? endOfLocalDay(controls.expires.value) : null;
    this.busy.set(true);
    this.error.set(null);
    this.keys.update(this.key.id, changes).subscribe({
      next: (updated) => this.dialogRef.close(updated),
      error: (error: unknown) => {
        this.busy.set(false);
        this.error.set(errorMessage(error));
      },
    });
  }
}
