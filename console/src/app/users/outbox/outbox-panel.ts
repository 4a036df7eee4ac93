import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatExpansionModule } from '@angular/material/expansion';
import { RouterLink } from '@angular/router';
import { formatDateTime } from '../../format/format';
import { OutboxMessage } from '../user.model';
import { recipients, splitLinks } from './message-text';

/** The development mail server's messages: what the service would have e-mailed. */
@Component({
  selector: 'iso-outbox-panel',
  imports: [MatExpansionModule, RouterLink],
  template: `
    @if (messages().length === 0) {
      <p class="iso-notice">No e-mail sent yet. Invitations and key notices appear here in development.</p>
    } @else {
      <mat-accordion displayMode="flat" multi>
        @for (message of view(); track message.id) {
          <mat-expansion-panel data-testid="outbox-message">
            <mat-expansion-panel-header>
              <mat-panel-title>{{ message.subject }}</mat-panel-title>
              <mat-panel-description>{{ message.to }} · {{ message.sent }}</mat-panel-description>
            </mat-expansion-panel-header>
            <pre
              class="body"
            >@for (part of message.parts; track $index) {@if (part.href?.startsWith('/')) {<a [routerLink]="part.href!.split('?')[0]" [queryParams]="query(part.href!)">{{ part.text }}</a>} @else if (part.href) {<a [href]="part.href" rel="noopener noreferrer" target="_blank">{{ part.text }}</a>} @else {{{ part.text }}}}</pre>
          </mat-expansion-panel>
        }
      </mat-accordion>
    }
  `,
  styles: `
    .body {
      white-space: pre-wrap;
      overflow-wrap: anywhere;
      margin: 0;
      font-family: var(--iso-mono);
      font-size: 0.9em;
    }
    mat-panel-description {
      overflow: hidden;
      text-overflow: ellipsis;
      white-space: nowrap;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OutboxPanel {
  readonly messages = input.required<OutboxMessage[]>();
  private readonly origin = inject(DOCUMENT).location.origin;

  protected readonly view = computed(() =>
    this.messages().map((message) => ({
      id: message.id,
      subject: message.subject || '(no subject)',
      to: recipients(message.to),
      sent: formatDateTime(message.sentAt),
      parts: splitLinks(message.text ?? '', this.origin),
    })),
  );

  protected query(href: string): Record<string, string> {
    const search = href.split('?')[1] ?? '';
    return Object.fromEntries(new URLSearchParams(search).entries());
  }
}
