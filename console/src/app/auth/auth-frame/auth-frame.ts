import { ChangeDetectionStrategy, Component, input } from '@angular/core';

/** The calm, centred frame shared by the sign-in and invitation pages. */
@Component({
  selector: 'iso-auth-frame',
  templateUrl: './auth-frame.html',
  styleUrl: './auth-frame.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuthFrame {
  readonly heading = input.required<string>();
}
