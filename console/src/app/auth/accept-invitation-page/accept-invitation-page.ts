import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';
import { errorMessage } from '../../problem/http-problem';
import { AuthFrame } from '../auth-frame/auth-frame';
import { SessionService } from '../session.service';
import { passwordProblems } from './password-rules';

@Component({
  selector: 'iso-accept-invitation-page',
  imports: [
    AuthFrame,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    ReactiveFormsModule,
    RouterLink,
  ],
  templateUrl: './accept-invitation-page.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcceptInvitationPage {
  private readonly session = inject(SessionService);
  private readonly router = inject(Router);

  readonly token = input<string>();

  protected readonly busy = signal(false);
  protected readonly done = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly form = inject(NonNullableFormBuilder).group({ password: [''], repeat: [''] });
  private readonly values = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  protected readonly problems = computed(() => {
    const { password = '', repeat = '' } = this.values();
    return passwordProblems(password, repeat);
  });
  protected readonly touched = signal(false);

  protected submit(): void {
    this.touched.set(true);
    const token = this.token();
    if (!token || this.problems().length > 0) return;
    this.busy.set(true);
    this.error.set(null);
    this.session.acceptInvitation(token, this.form.getRawValue().password).subscribe({
      next: () => {
        this.busy.set(false);
        this.done.set(true);
        void this.router.navigate(['/']);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.error.set(errorMessage(error));
      },
    });
  }
}
