import { Injectable, signal } from '@angular/core';

/**
 * A key secret the person chose to carry from the key dialog to the playground. Memory only: it is
 * never written to storage, so a reload forgets it, just as the server never shows it again.
 */
@Injectable({ providedIn: 'root' })
export class PlaygroundCredentials {
  readonly keySecret = signal<string>('');
  readonly keyLabel = signal<string>('');

  offer(secret: string, label: string): void {
    this.keySecret.set(secret);
    this.keyLabel.set(label);
  }
}
