import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { Observable, filter, of, switchMap } from 'rxjs';
import { SessionService } from '../../auth/session.service';
import { formatDateTime, formatQuantity, formatSigned } from '../../format/format';
import { errorMessage, toProblem } from '../../problem/http-problem';
import type { FieldProblem } from '../../problem/problem-message';
import { RoomsService } from '../../rooms/rooms.service';
import { DuplicateDialog } from '../../rooms/room-page/duplicate-dialog';
import { ConfirmDialog, ConfirmDialogData } from '../../ui/confirm-dialog/confirm-dialog';
import { ChannelEditor } from '../channel-editor/channel-editor';
import { ComparisonView } from '../comparison/comparison-view';
import { TuningDetails, TuningDetailsDialog } from '../tuning-details-dialog';
import type { Tuning, TuningChannelInput, TuningComparison, TuningVersion } from '../tuning.model';
import { channelFieldOf, channelRows, versionAuthor, versionOrigin, versionsPhrase } from '../tuning-view';
import { TuningsService } from '../tunings.service';
import { ExportDialog, ExportDialogData } from '../export-dialog/export-dialog';

/**
 * One tuning: its channels in a table with an editor beside it, its versions with their differences,
 * restore, comparison with any tuning or version of the room, and the tuning's own report and export.
 */
@Component({
  selector: 'iso-tuning-page',
  imports: [
    ChannelEditor,
    ComparisonView,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatMenuModule,
    MatProgressBarModule,
    MatSelectModule,
    MatTableModule,
    RouterLink,
  ],
  templateUrl: './tuning-page.html',
  styleUrl: './tuning-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TuningPage {
  private readonly rooms = inject(RoomsService);
  private readonly tuningsApi = inject(TuningsService);
  private readonly session = inject(SessionService);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly router = inject(Router);

  readonly roomId = input.required<string>();
  readonly tuningId = input.required<string>();
  /** `?version=` from the address: a past version, shown read-only with a Restore button. */
  readonly version = input<string | undefined>();

  private readonly versionNumber = computed(() => {
    const parsed = Number(this.version());
    return Number.isInteger(parsed) && parsed > 0 ? parsed : undefined;
  });

  private readonly roomResource = rxResource({
    params: () => this.roomId(),
    stream: ({ params }) => this.rooms.room(params),
  });
  private readonly roomTuningsResource = rxResource({
    params: () => this.roomId(),
    stream: ({ params }) => this.rooms.tunings(params),
  });
  private readonly tuningResource = rxResource({
    params: () => ({ id: this.tuningId(), version: this.versionNumber() }),
    stream: ({ params }) => this.tuningsApi.tuning(params.id, params.version),
  });
  /** The room's processor profile: the editor checks against it as the API does. */
  private readonly profileResource = rxResource({
    params: () => this.room()?.profileId ?? undefined,
    stream: ({ params }) => this.rooms.profile(params),
  });
  protected readonly profile = computed(() =>
    this.profileResource.hasValue() ? this.profileResource.value() : null,
  );
  private readonly versionsResource = rxResource({
    params: () => this.tuningId(),
    stream: ({ params }) => this.tuningsApi.versions(params),
  });

  protected readonly room = computed(() => (this.roomResource.hasValue() ? this.roomResource.value() : null));
  protected readonly tuning = computed(() =>
    this.tuningResource.hasValue() ? this.tuningResource.value() : null,
  );
  protected readonly versions = computed(() =>
    this.versionsResource.hasValue() ? [...this.versionsResource.value()].reverse() : [],
  );
  protected readonly roomTunings = computed(() =>
    this.roomTuningsResource.hasValue() ? this.roomTuningsResource.value() : [],
  );
  protected readonly loading = computed(
    () => this.tuningResource.isLoading() || this.roomResource.isLoading() || this.busy(),
  );
  protected readonly error = computed(() => {
    const error = this.tuningResource.error() ?? this.roomResource.error();
    return error ? toProblem(error) : null;
  });
  protected readonly versionsError = computed(() => {
    const error = this.versionsResource.error();
    return error ? errorMessage(error) : null;
  });
  protected readonly isPast = computed(() => {
    const tuning = this.tuning();
    return tuning !== null && tuning.version !== tuning.latestVersion;
  });
  protected readonly rows = computed(() => {
    const tuning = this.tuning();
    const room = this.room();
    if (!tuning) return [];
    const names = new Map((room?.loudspeakers ?? []).map((speaker) => [speaker.id, speaker.name ?? '']));
    return channelRows(tuning, room?.limits, names, this.profile());
  });
  protected readonly selectedId = signal<string | null>(null);
  protected readonly selected = computed(() => {
    const tuning = this.tuning();
    if (!tuning) return null;
    return tuning.channels.find((channel) => channel.id === this.selectedId()) ?? tuning.channels[0] ?? null;
  });
  protected readonly reportUrl = computed(() => {
    const tuning = this.tuning();
    const params = new URLSearchParams({ tuningId: this.tuningId() });
    if (tuning) params.set('version', String(tuning.version));
    return `/v1/rooms/${encodeURIComponent(this.roomId())}/report?${params}`;
  });

  protected readonly saving = signal(false);
  protected readonly busy = signal(false);
  protected readonly editorDirty = signal(false);
  protected readonly serverErrors = signal<FieldProblem[]>([]);
  protected readonly saveProblem = signal<string | null>(null);

  protected readonly diff = signal<{ version: number; result: TuningComparison } | null>(null);
  protected readonly compareWith = signal<string>('');
  protected readonly compareVersion = signal<number | null>(null);
  protected readonly comparison = signal<TuningComparison | null>(null);
  protected readonly compareOptions = computed(() =>
    this.roomTunings().flatMap((tuning) =>
      Array.from({ length: tuning.latestVersion }, (_, i) => tuning.latestVersion - i).map((version) => ({
        key: `${tuning.id}@${version}`,
        label: `${tuning.name} · v${version}${version === tuning.latestVersion ? ' (latest)' : ''}`,
      })),
    ),
  );

  protected readonly channelColumns = ['id', 'delay', 'samples', 'trim', 'polarity', 'highPass', 'eq'];
  protected readonly versionColumns = ['version', 'origin', 'when', 'who', 'actions'];

  protected readonly formatQuantity = formatQuantity;
  protected readonly formatSigned = formatSigned;
  protected readonly formatDateTime = formatDateTime;
  protected readonly versionOrigin = versionOrigin;

  constructor() {
    // A different tuning or version starts with no leftovers of the last one.
    effect(() => {
      this.tuningId();
      this.versionNumber();
      this.diff.set(null);
      this.comparison.set(null);
      this.serverErrors.set([]);
      this.saveProblem.set(null);
    });
  }

  protected author(version: TuningVersion): string {
    return versionAuthor(version, this.session.user()?.id ?? null);
  }

  protected reload(): void {
    this.tuningResource.reload();
    this.roomResource.reload();
    this.versionsResource.reload();
  }

  protected select(id: string): void {
    if (id === this.selected()?.id) return;
    this.confirmDiscard().subscribe((go) => {
      if (!go) return;
      this.serverErrors.set([]);
      this.saveProblem.set(null);
      this.selectedId.set(id);
      // Where the editor sits under the table, bring its top into view if it is off-screen.
      requestAnimationFrame(() => {
        const editor = document.getElementById('editor-title');
        const top = editor?.getBoundingClientRect().top ?? 0;
        if (editor && (top > window.innerHeight - 120 || top < 0)) {
          editor.scrollIntoView({ block: 'start', behavior: 'smooth' });
        }
      });
    });
  }

  private confirmDiscard(): Observable<boolean> {
    if (!this.editorDirty()) return of(true);
    const channel = this.selected()?.id ?? 'this channel';
    return this.dialog
      .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, {
        data: {
          title: `Discard the changes to ${channel}?`,
          message: 'They have not been saved. Save them first to keep them as a new version.',
          confirmLabel: 'Discard changes',
          destructive: true,
        },
      })
      .afterClosed()
      .pipe(switchMap((answer) => of(answer === true)));
  }

  protected saveChannel(channel: TuningChannelInput): void {
    this.saving.set(true);
    this.serverErrors.set([]);
    this.saveProblem.set(null);
    this.tuningsApi.update(this.tuningId(), { channels: [channel] }).subscribe({
      next: (tuning) => {
        this.saving.set(false);
        this.showTuning(tuning);
        this.snackBar.open(`${channel.id} saved as version ${tuning.version}.`, undefined, {
          duration: 4000,
        });
      },
      error: (error: unknown) => {
        this.saving.set(false);
        const problem = toProblem(error);
        const onChannel = problem.fieldErrors.flatMap((field) => {
          const pointer = channelFieldOf(field.pointer);
          return pointer === null ? [] : [{ pointer, message: field.message }];
        });
        this.serverErrors.set(onChannel);
        this.saveProblem.set(
          onChannel.length === problem.fieldErrors.length && onChannel.length
            ? `${problem.title}: see the marked fields.`
            : errorMessage(error),
        );
      },
    });
  }

  /** The answer of a write is the new latest version: show it without another request. */
  private showTuning(tuning: Tuning): void {
    this.tuningResource.set(tuning);
    this.versionsResource.reload();
    this.roomTuningsResource.reload();
    this.editorDirty.set(false);
    if (this.versionNumber()) {
      void this.router.navigate([], { queryParams: { version: null }, queryParamsHandling: 'merge' });
    }
  }

  protected editDetails(): void {
    const tuning = this.tuning();
    if (!tuning) return;
    this.dialog
      .open<TuningDetailsDialog, TuningDetails, TuningDetails>(TuningDetailsDialog, {
        data: { name: tuning.name, notes: tuning.notes },
        width: '520px',
        maxWidth: '94vw',
      })
      .afterClosed()
      .pipe(
        filter((details): details is TuningDetails => Boolean(details)),
        switchMap((details) => this.tuningsApi.update(tuning.id, details)),
      )
      .subscribe({
        next: (updated) => {
          this.showTuning(updated);
          this.snackBar.open(`Saved as version ${updated.version}.`, undefined, { duration: 4000 });
        },
        error: (error: unknown) => this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 10000 }),
      });
  }

  protected restore(version: number): void {
    const tuning = this.tuning();
    if (!tuning) return;
    this.confirmDiscard()
      .pipe(
        filter(Boolean),
        switchMap(() => {
          this.busy.set(true);
          return this.tuningsApi.restore(tuning.id, version);
        }),
      )
      .subscribe({
        next: (restored) => {
          this.busy.set(false);
          this.showTuning(restored);
          this.snackBar.open(`Version ${version} restored as version ${restored.version}.`, undefined, {
            duration: 5000,
          });
        },
        error: (error: unknown) => {
          this.busy.set(false);
          this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 10000 });
        },
      });
  }

  protected showChanges(version: number): void {
    if (version < 2) return;
    const id = this.tuningId();
    this.tuningsApi.compare({ tuningId: id, version: version - 1 }, { tuningId: id, version }).subscribe({
      next: (result) => this.diff.set({ version, result }),
      error: (error: unknown) => this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 10000 }),
    });
  }

  protected compare(): void {
    const tuning = this.tuning();
    const [otherId, otherVersion] = this.compareWith().split('@');
    if (!tuning || !otherId) return;
    this.tuningsApi
      .compare(
        { tuningId: tuning.id, version: tuning.version },
        { tuningId: otherId, version: Number(otherVersion) },
      )
      .subscribe({
        next: (result) => this.comparison.set(result),
        error: (error: unknown) => this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 10000 }),
      });
  }

  protected duplicate(): void {
    const tuning = this.tuning();
    if (!tuning) return;
    this.dialog
      .open(DuplicateDialog, {
        data: { name: `${tuning.name} (variant)`, title: `Duplicate “${tuning.name}” v${tuning.version}` },
        width: '460px',
        maxWidth: '94vw',
      })
      .afterClosed()
      .pipe(
        filter((name): name is string => Boolean(name)),
        switchMap((name) => this.tuningsApi.duplicate(tuning.id, name, tuning.version)),
      )
      .subscribe({
        next: (copy) => {
          this.snackBar.open(`“${copy.name}” created from “${tuning.name}” v${tuning.version}.`, undefined, {
            duration: 4000,
          });
          void this.router.navigate(['/rooms', this.roomId(), 'tunings', copy.id]);
        },
        error: (error: unknown) => this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 10000 }),
      });
  }

  /** Export for a processor: profile, rate, what rounding cost, then the download. */
  protected openExport(): void {
    const tuning = this.tuning();
    if (!tuning) return;
    this.dialog.open<ExportDialog, ExportDialogData>(ExportDialog, {
      data: { tuning, roomProfileId: this.room()?.profileId ?? null },
      width: '760px',
      maxWidth: '96vw',
    });
  }

  protected remove(): void {
    const tuning = this.tuning();
    if (!tuning) return;
    this.dialog
      .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, {
        data: {
          title: `Delete “${tuning.name}”?`,
          message: `${versionsPhrase(tuning.latestVersion)} of this tuning ${tuning.latestVersion === 1 ? 'is' : 'are'} deleted for good. Exported files and printed reports are not affected.`,
          confirmLabel: 'Delete tuning',
          destructive: true,
        },
      })
      .afterClosed()
      .pipe(
        filter(Boolean),
        switchMap(() => this.tuningsApi.remove(tuning.id)),
      )
      .subscribe({
        next: () => {
          this.snackBar.open(`“${tuning.name}” deleted.`, undefined, { duration: 4000 });
          void this.router.navigate(['/rooms', this.roomId()]);
        },
        error: (error: unknown) => this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 10000 }),
      });
  }
}
