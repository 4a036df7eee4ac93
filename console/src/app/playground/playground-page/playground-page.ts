import { DOCUMENT } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  signal,
  untracked,
} from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { Router } from '@angular/router';
import { SessionService } from '../../auth/session.service';
import { roleLabel } from '../../auth/roles';
import { errorMessage } from '../../problem/http-problem';
import { parseJsonText } from '../json-text';
import { PlaygroundOperation, groupByTag, listOperations } from '../openapi-operations';
import { PlaygroundCredentials } from '../playground-credentials.service';
import { PlaygroundAuth, PlaygroundResponse, PlaygroundService } from '../playground.service';
import { buildDraft } from '../request-draft';
import { RichText } from '../../ui/rich-text/rich-text';
import { ResponsePanel } from '../response-panel/response-panel';
import { checkAgainstSchema } from '../schema-check';
import { SnippetTabs } from '../snippet-tabs/snippet-tabs';

/** The operation a first visit opens: a single peaking filter shows the whole loop, plot included. */
const PREFERRED_FIRST = ['designBiquads'];

function firstParagraph(text: string): string {
  return (
    text
      .split(/\n\s*\n/)[0]
      ?.replace(/\s+/g, ' ')
      .trim() ?? ''
  );
}

@Component({
  selector: 'iso-playground-page',
  imports: [
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatRadioModule,
    MatSelectModule,
    ResponsePanel,
    RichText,
    SnippetTabs,
  ],
  templateUrl: './playground-page.html',
  styleUrl: './playground-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlaygroundPage {
  private readonly playground = inject(PlaygroundService);
  private readonly session = inject(SessionService);
  private readonly router = inject(Router);
  private readonly credentials = inject(PlaygroundCredentials);
  protected readonly origin = inject(DOCUMENT).location.origin;

  /** `?op=<operationId>` keeps the chosen operation in the address, so it can be bookmarked. */
  readonly op = input<string>();

  private readonly documentResource = rxResource({ stream: () => this.playground.document() });
  protected readonly loadError = computed(() => {
    const error = this.documentResource.error();
    return error ? errorMessage(error) : null;
  });
  private readonly document = computed(() =>
    this.documentResource.hasValue() ? this.documentResource.value() : null,
  );
  protected readonly operations = computed(() => {
    const document = this.document();
    return document ? listOperations(document).filter((operation) => operation.path.startsWith('/v1/')) : [];
  });
  protected readonly groups = computed(() =>
    groupByTag(
      this.operations(),
      (this.document()?.tags ?? []).map((tag) => tag.name),
    ),
  );
  protected readonly operation = computed<PlaygroundOperation | null>(() => {
    const operations = this.operations();
    const wanted = this.op();
    return (
      operations.find((operation) => operation.id === wanted) ??
      operations.find((operation) => PREFERRED_FIRST.includes(operation.id)) ??
      operations.find((operation) => operation.path === '/v1/biquads') ??
      operations[0] ??
      null
    );
  });
  protected readonly lead = computed(() => firstParagraph(this.operation()?.description ?? ''));
  protected readonly docsLink = computed(() => {
    const operation = this.operation();
    return operation
      ? `/docs/#/${encodeURIComponent(operation.tag)}/${encodeURIComponent(operation.id)}`
      : '/docs/';
  });

  protected readonly exampleName = signal('');
  protected readonly bodyText = signal('');
  protected readonly paramValues = signal<Record<string, string>>({});
  protected readonly authKind = signal<'session' | 'key'>(
    this.credentials.keySecret() || !this.session.can('calculate:session') ? 'key' : 'session',
  );
  protected readonly keySecret = signal(this.credentials.keySecret());
  protected readonly keyLabel = this.credentials.keyLabel;
  protected readonly sessionLimited = computed(() => !this.session.can('calculate:session'));
  /** The signed-in role in words, for the note that says what this role can do here. */
  protected readonly roleName = computed(() => roleLabel(this.session.role() ?? 'unknown'));
  /** Whether the role may hold keys of its own (else a key has to come from a colleague). */
  protected readonly holdsKeys = computed(() => this.session.can('keys:view'));

  protected readonly parsed = computed(() => parseJsonText(this.bodyText()));
  protected readonly schemaProblems = computed(() => {
    const operation = this.operation();
    const parsed = this.parsed();
    if (!operation?.bodySchema || parsed.error || parsed.value === undefined) return [];
    return checkAgainstSchema(parsed.value, operation.bodySchema, this.document());
  });
  protected readonly built = computed(() => {
    const operation = this.operation();
    if (!operation) return null;
    return buildDraft(operation, this.paramValues(), this.parsed().error ? undefined : this.parsed().value);
  });
  protected readonly blockers = computed(() => {
    const list: string[] = [];
    const operation = this.operation();
    if (operation?.unsupported) list.push(operation.unsupported);
    if (this.parsed().error) list.push(`The body is not valid JSON. ${this.parsed().error}`);
    for (const problem of this.built()?.problems ?? []) {
      // An unreadable body is already reported above; "needs a body" would only repeat it.
      if (!(problem.field === 'body' && this.parsed().error)) list.push(problem.message);
    }
    if (this.authKind() === 'key' && !operation?.open && !this.keySecret().trim())
      list.push(
        this.sessionLimited()
          ? 'Paste an API key: your role cannot send this with the console session.'
          : 'Paste an API key, or send with your session.',
      );
    return list;
  });

  protected readonly sending = signal(false);
  protected readonly response = signal<PlaygroundResponse | null>(null);
  protected readonly sentBody = signal<unknown>(undefined);

  constructor() {
    effect(() => {
      const operation = this.operation();
      untracked(() => this.loadOperation(operation));
    });
  }

  protected chooseOperation(id: string): void {
    void this.router.navigate([], { queryParams: { op: id }, replaceUrl: true });
  }

  protected chooseExample(name: string): void {
    const example = this.operation()?.examples.find((candidate) => candidate.name === name);
    this.exampleName.set(name);
    this.bodyText.set(example ? JSON.stringify(example.value, null, 2) : '');
  }

  protected setParam(key: string, value: string): void {
    this.paramValues.update((values) => ({ ...values, [key]: value }));
  }

  protected paramValue(key: string): string {
    return this.paramValues()[key] ?? '';
  }

  protected setKey(secret: string): void {
    this.keySecret.set(secret);
  }

  protected format(): void {
    const parsed = this.parsed();
    if (!parsed.error && parsed.value !== undefined) this.bodyText.set(JSON.stringify(parsed.value, null, 2));
  }

  protected send(): void {
    const built = this.built();
    if (!built || this.blockers().length) return;
    const auth: PlaygroundAuth =
      this.authKind() === 'key' && !this.operation()?.open
        ? { kind: 'key', secret: this.keySecret() }
        : { kind: 'session' };
    this.sending.set(true);
    this.sentBody.set(this.parsed().value);
    this.playground.send(built.draft, auth).subscribe({
      next: (response) => {
        this.sending.set(false);
        this.response.set(response);
      },
      error: (error: unknown) => {
        this.sending.set(false);
        this.response.set({ status: 0, statusText: errorMessage(error), headers: [], bodyText: '' });
      },
    });
  }

  private loadOperation(operation: PlaygroundOperation | null): void {
    this.response.set(null);
    if (!operation) return;
    const values: Record<string, string> = {};
    for (const parameter of operation.parameters) {
      if (parameter.in === 'path' || parameter.required)
        values[`${parameter.in}:${parameter.name}`] = parameter.example;
    }
    this.paramValues.set(values);
    const first = operation.examples[0];
    this.exampleName.set(first?.name ?? '');
    this.bodyText.set(first ? JSON.stringify(first.value, null, 2) : '');
  }
}
