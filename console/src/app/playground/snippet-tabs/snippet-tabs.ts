import { Clipboard } from '@angular/cdk/clipboard';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTabsModule } from '@angular/material/tabs';
import { RequestDraft } from '../request-draft';
import { DEFAULT_KEY_VARIABLE, curlSnippet, fetchSnippet, pythonSnippet } from '../snippets';

/** The request on screen as curl, JavaScript and Python, each with a copy button. */
@Component({
  selector: 'iso-snippet-tabs',
  imports: [MatButtonModule, MatIconModule, MatTabsModule],
  template: `
    <mat-tab-group animationDuration="0ms" mat-stretch-tabs="false" aria-label="Code snippets">
      @for (snippet of snippets(); track snippet.id) {
        <mat-tab [label]="snippet.label">
          <div class="snippet">
            <div class="snippet-head">
              <span class="snippet-hint">{{ snippet.hint }}</span>
              <button
                mat-stroked-button
                type="button"
                class="copy"
                (click)="copy(snippet.id, snippet.code)"
                [attr.data-testid]="'copy-' + snippet.id"
                [attr.aria-label]="'Copy the ' + snippet.label + ' snippet'"
              >
                <mat-icon>{{ copied() === snippet.id ? 'check' : 'content_copy' }}</mat-icon>
                {{ copied() === snippet.id ? 'Copied' : 'Copy' }}
              </button>
            </div>
            <pre
              class="code"
              tabindex="0"
              [attr.aria-label]="snippet.label + ' snippet'"
              [attr.data-testid]="'snippet-' + snippet.id"
              >{{ snippet.code }}</pre>
          </div>
        </mat-tab>
      }
    </mat-tab-group>
    @if (keyVariable()) {
      <p class="note">
        The snippets read the key from the <code>{{ keyVariable() }}</code> environment variable, so it never
        lands in shell history or source control.
      </p>
    }
  `,
  styles: `
    .snippet {
      padding-top: 8px;
    }
    .snippet-head {
      display: flex;
      align-items: center;
      justify-content: space-between;
      gap: 12px;
      margin-bottom: 8px;
    }
    .snippet-hint {
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
    }
    .code {
      margin: 0;
      padding: 14px 16px;
      min-height: 60px;
      max-height: 360px;
      overflow: auto;
      border-radius: var(--mat-sys-corner-medium);
      background: var(--mat-sys-surface-container-highest);
      font-family: var(--iso-mono);
      font-size: 13px;
      line-height: 1.5;
    }
    .note {
      margin: 8px 0 0;
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SnippetTabs {
  readonly draft = input.required<RequestDraft>();
  readonly origin = input.required<string>();
  /** False for operations that need no credentials. */
  readonly needsKey = input(true);

  private readonly clipboard = inject(Clipboard);
  protected readonly copied = signal<string | null>(null);
  protected readonly keyVariable = computed(() => (this.needsKey() ? DEFAULT_KEY_VARIABLE : null));
  protected readonly snippets = computed(() => {
    const options = { origin: this.origin(), keyVariable: this.keyVariable() };
    const draft = this.draft();
    return [
      { id: 'curl', label: 'curl', hint: 'POSIX shell', code: curlSnippet(draft, options) },
      {
        id: 'fetch',
        label: 'JavaScript fetch',
        hint: 'Node 18+ (ES module) or a browser',
        code: fetchSnippet(draft, options),
      },
      {
        id: 'python',
        label: 'Python requests',
        hint: 'Python 3 with the requests package',
        code: pythonSnippet(draft, options),
      },
    ];
  });

  protected copy(id: string, code: string): void {
    if (this.clipboard.copy(code)) this.copied.set(id);
  }
}
