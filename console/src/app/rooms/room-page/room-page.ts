import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
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
import { filter, switchMap } from 'rxjs';
import { formatDateTime, formatQuantity, formatSigned } from '../../format/format';
import { errorMessage, toProblem } from '../../problem/http-problem';
import { Tuning, TuningComparison } from '../room.model';
import { RoomsService } from '../rooms.service';
import { RoomMeasurements } from '../room-measurements/room-measurements';
import { PlanEditor } from '../room-editor/plan-editor';
import { DuplicateDialog } from './duplicate-dialog';
import { ComparisonView } from '../../tunings/comparison/comparison-view';
import { TuningsService } from '../../tunings/tunings.service';
import { ExportDialog, ExportDialogData } from '../../tunings/export-dialog/export-dialog';

@Component({
  selector: 'iso-room-page',
  imports: [
    ComparisonView,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatMenuModule,
    MatProgressBarModule,
    MatSelectModule,
    MatTableModule,
    PlanEditor,
    RoomMeasurements,
    RouterLink,
  ],
  templateUrl: './room-page.html',
  styleUrl: './room-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RoomPage {
  private readonly rooms = inject(RoomsService);
  private readonly tuningsApi = inject(TuningsService);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly router = inject(Router);

  readonly roomId = input.required<string>();

  private readonly roomResource = rxResource({
    params: () => this.roomId(),
    stream: ({ params }) => this.rooms.room(params),
  });
  private readonly tuningsResource = rxResource({
    params: () => this.roomId(),
    stream: ({ params }) => this.rooms.tunings(params),
  });

  protected readonly room = computed(() => (this.roomResource.hasValue() ? this.roomResource.value() : null));
  protected readonly loading = computed(
    () => this.roomResource.isLoading() || this.tuningsResource.isLoading(),
  );
  protected readonly error = computed(() => {
    const error = this.roomResource.error() ?? this.tuningsResource.error();
    return error ? { message: errorMessage(error), status: toProblem(error).status } : null;
  });
  protected readonly tunings = computed(() =>
    this.tuningsResource.hasValue() ? this.tuningsResource.value() : [],
  );
  protected readonly channels = computed(() => {
    const room = this.room();
    if (!room) return [];
    const names = new Map(room.loudspeakers.map((speaker) => [speaker.id, speaker.name ?? '']));
    return room.geometry.speakers.map((speaker) => ({ ...speaker, name: names.get(speaker.id) ?? '' }));
  });
  /** The printable report of one tuning at the version listed (the room's latest-changed one without). */
  protected reportUrl(tuning?: Tuning): string {
    const base = `/v1/rooms/${encodeURIComponent(this.roomId())}/report`;
    if (!tuning) return base;
    return `${base}?${new URLSearchParams({ tuningId: tuning.id, version: String(tuning.version) })}`;
  }

  protected readonly channelColumns = [
    'id',
    'name',
    'distance',
    'azimuth',
    'elevation',
    'deviation',
    'tolerance',
  ];
  protected readonly tuningColumns = ['name', 'version', 'origin', 'channels', 'updated', 'actions'];

  protected readonly left = signal<string>('');
  protected readonly right = signal<string>('');
  protected readonly comparison = signal<TuningComparison | null>(null);
  protected readonly comparing = signal(false);

  protected readonly formatQuantity = formatQuantity;
  protected readonly formatSigned = formatSigned;
  protected readonly formatDateTime = formatDateTime;

  protected reload(): void {
    this.roomResource.reload();
    this.tuningsResource.reload();
  }

  /** A first tuning with every loudspeaker of the room at neutral settings, opened for editing. */
  protected newTuning(): void {
    const room = this.room();
    if (!room) return;
    this.dialog
      .open(DuplicateDialog, {
        data: {
          title: 'New tuning',
          lead: 'Every loudspeaker starts with no delay, no trim and no EQ.',
          name: 'Tuning 1',
          action: 'Create',
        },
        width: '460px',
        maxWidth: '94vw',
      })
      .afterClosed()
      .pipe(
        filter((name): name is string => Boolean(name)),
        switchMap((name) =>
          this.tuningsApi.create(room.id, {
            name,
            sampleRateHz: room.sampleRateHz,
            channels: room.loudspeakers.map((speaker) => ({ id: speaker.id, delayMs: 0, trimDb: 0 })),
          }),
        ),
      )
      .subscribe({
        next: (tuning) => void this.router.navigate(['/rooms', room.id, 'tunings', tuning.id]),
        error: (error: unknown) => this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 10000 }),
      });
  }

  protected duplicate(tuning: Tuning): void {
    this.dialog
      .open(DuplicateDialog, {
        data: { name: `${tuning.name} (variant)`, title: `Duplicate “${tuning.name}”` },
        width: '460px',
        maxWidth: '94vw',
      })
      .afterClosed()
      .pipe(
        filter((name): name is string => Boolean(name)),
        switchMap((name) => this.tuningsApi.duplicate(tuning.id, name)),
      )
      .subscribe({
        next: (copy) => {
          this.tuningsResource.reload();
          this.snackBar.open(`“${copy.name}” created from “${tuning.name}”.`, undefined, { duration: 4000 });
        },
        error: (error: unknown) => this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 10000 }),
      });
  }

  /** Export for a processor: profile, rate, what rounding cost, then the download. */
  protected openExport(tuning: Tuning): void {
    this.dialog.open<ExportDialog, ExportDialogData>(ExportDialog, {
      data: { tuning, roomProfileId: this.room()?.profileId ?? null },
      width: '760px',
      maxWidth: '96vw',
    });
  }

  protected compare(): void {
    if (!this.left() || !this.right()) return;
    this.comparing.set(true);
    this.tuningsApi.compare({ tuningId: this.left() }, { tuningId: this.right() }).subscribe({
      next: (result) => {
        this.comparing.set(false);
        this.comparison.set(result);
      },
      error: (error: unknown) => {
        this.comparing.set(false);
        this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 10000 });
      },
    });
  }
}
