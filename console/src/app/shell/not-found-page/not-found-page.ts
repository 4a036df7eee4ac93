import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { RouterLink } from '@angular/router';

@Component({
  selector: 'iso-not-found-page',
  imports: [MatButtonModule, RouterLink],
  template: `
    <h1 class="iso-page-title">Nothing here</h1>
    <p class="iso-page-lead">
      This console page does not exist. The API itself lives under <code>/v1</code>.
    </p>
    <a mat-flat-button [routerLink]="home">Back to the overview</a>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotFoundPage {
  protected readonly home = '/';
}
