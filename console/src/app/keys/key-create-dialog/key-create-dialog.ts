import { Clipboard } from '@angular/cdk/clipboard';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { Router } from '@angular/router';
import { grantableKeyRoles, roleLabel } from '../../auth/roles';
import { SessionService } from '../../auth/session.service';
import { PlaygroundCredentials } from '../../playground/playground-credentials.service';
import { errorMessage } from '../../problem/http-problem';
import { notBlank } from '../../tunings/tuning-details-dialog';
import { LIMITS, NAME_MAX_LENGTH } from '../../../../../shared/limits';
import { formatCount } from '../../format/format';
import { endOfLocalDay } from '../key-format';
import { CreatedKey, KeyRole, NewKeyRequest } from '../key.model';
import { KeysService } from '../keys.service';

const ROLE_HINTS: Record<KeyRole, string> = {
  calculate: 'Stateless calculations only.',
  tuning: 'Calculations plus its owner’s rooms, tunings and measurements.',
  admin: 'Everything, including keys, usage and users of everyone.',
};

/** Creates a key, then shows its secret once; closing returns the created key (without the secret). */
@Component({
  selector: 'iso-key-create-dialog',
  imports: [
    MatButtonModule,
    MatCheckboxModule,
    MatDatepickerModule,
    MatDialogModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    ReactiveFormsModule,
  ],
  templateUrl: './key-create-dialog.html',
  styleUrl: './key-create-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class KeyCreateDialog {
  private readonly keys = inject(KeysService);
  private readonly session = inject(SessionService);
  private readonly clipboard = inject(Clipboard);
  private readonly router = inject(Router);
  private readonly credentials = inject(PlaygroundCredentials);
  private readonly dialogRef = inject<MatDialogRef<KeyCreateDialog, CreatedKey | undefined>>(MatDialogRef);

  protected readonly roles = grantableKeyRoles(this.session.role());
  protected readonly roleHints = ROLE_HINTS;
  protected readonly roleLabel = roleLabel;
  protected readonly canSetRateLimit = this.session.can('keys:setRateLimit');
  protected readonly today = new Date();
  protected readonly maxName = NAME_MAX_LENGTH;
  protected readonly rateLimit = LIMITS.KeyRateLimit;
  protected readonly rateLimitRange = `Between ${formatCount(LIMITS.KeyRateLimit.minimum)} and ${formatCount(LIMITS.KeyRateLimit.maximum)}.`;

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, notBlank, Validators.maxLength(NAME_MAX_LENGTH)]],
    role: [this.roles.includes('calculate') ? ('calculate' as KeyRole) : this.roles[0], Validators.required],
    expires: [null as Date | null],
    rateLimitPerMinute: [
      null as number | null,
      [Validators.min(LIMITS.KeyRateLimit.minimum), Validators.max(LIMITS.KeyRateLimit.maximum)],
    ],
  });

  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly created = signal<CreatedKey | null>(null);
  protected readonly copied = signal(false);
  protected readonly stored = signal(false);
  protected readonly title = computed(() => (this.created() ? 'Your new key' : 'Create an API key'));

  protected submit(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const value = this.form.getRawValue();
    const request: NewKeyRequest = { name: value.name.trim(), role: value.role };
    if (value.expires) request.expiresAt = endOfLocalDay(value.expires);
    if (this.canSetRateLimit && value.rateLimitPerMinute)
      request.rateLimitPerMinute = value.rateLimitPerMinute;
    this.busy.set(true);
    this.error.set(null);
    this.keys.create(request).subscribe({
      next: (key) => {
        this.busy.set(false);
        this.created.set(key);
        // From here the secret must not vanish with a stray click or Escape before it was acknowledged.
        this.dialogRef.disableClose = true;
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.error.set(errorMessage(error));
      },
    });
  }

  protected copy(secret: string): void {
    this.copied.set(this.clipboard.copy(secret));
  }

  protected cancel(): void {
    this.dialogRef.close(undefined);
  }

  protected finish(): void {
    this.dialogRef.close(this.withoutSecret());
  }

  protected tryInPlayground(): void {
    const key = this.created();
    if (!key) return;
    this.credentials.offer(key.secret, key.name);
    this.dialogRef.close(this.withoutSecret());
    void this.router.navigate(['/playground']);
  }

  private withoutSecret(): CreatedKey | undefined {
    const key = this.created();
    return key ? { ...key, secret: '' } : undefined;
  }
}
