import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

@Component({
  selector: 'iso-docs-page',
  imports: [MatButtonModule, MatIconModule, RouterLink],
  templateUrl: './docs-page.html',
  styleUrl: './docs-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DocsPage {
  /** Served by the API process; a full page load, not a console route. */
  protected readonly referenceUrl = '/docs/';
  protected readonly contractUrl = '/openapi.json';
}
