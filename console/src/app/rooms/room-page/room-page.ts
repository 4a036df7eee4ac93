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
import { RouterLink } from '@angular/router';
import { filter, switchMap } from 'rxjs';
import { formatDateTime, formatQuantity, formatSigned } from '../../format/format';
import { errorMessage } from '../../problem/http-problem';
import { ChartView } from '../../ui/chart/chart';
import { Tuning, TuningComparison } from '../room.model';
import { RoomsService } from '../rooms.service';
import { RoomMeasurements } from '../room-measurements/room-measurements';
import { topViewChart } from '../top-view';
import { DuplicateDialog } from './duplicate-dialog';

@Component({
  selector: 'iso-room-page',
  imports: [
    ChartView,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatMenuModule,
    MatProgressBarModule,
    MatSelectModule,
    MatTableModule,
    RoomMeasurements,
    RouterLink,
  ],
  templateUrl: './room-page.html',
  styleUrl: './room-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RoomPage {
  private readonly rooms = inject(RoomsService);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);

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
    return error ? errorMessage(error) : null;
  });
  protected readonly tunings = computed(() =>
    this.tuningsResource.hasValue() ? this.tuningsResource.value() : [],
  );
  protected readonly topView = computed(() => {
    const room = this.room();
    return room ? topViewChart(room) : null;
  });
  protected readonly channels = computed(() => {
    const room = this.room();
    if (!room) return [];
    const names = new Map(room.loudspeakers.map((speaker) => [speaker.id, speaker.name ?? '']));
    return room.geometry.speakers.map((speaker) => ({ ...speaker, name: names.get(speaker.id) ?? '' }));
  });
  protected readonly reportUrl = computed(() => `/v1/rooms/${encodeURIComponent(this.roomId())}/report`);

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
  protected readonly compareColumns = ['id', 'delay', 'trim', 'polarity', 'highPass', 'eq', 'response'];

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

  protected duplicate(tuning: Tuning): void {
    this.dialog
      .open(DuplicateDialog, { data: tuning.name, width: '460px', maxWidth: '94vw' })
      .afterClosed()
      .pipe(
        filter((name): name is string => Boolean(name)),
        switchMap((name) => this.rooms.duplicate(tuning.id, name)),
      )
      .subscribe({
        next: (copy) => {
          this.tuningsResource.reload();
          this.snackBar.open(`“${copy.name}” created from “${tuning.name}”.`, undefined, { duration: 4000 });
        },
        error: (error: unknown) => this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 10000 }),
      });
  }

  protected export(tuning: Tuning, format: 'json' | 'csv'): void {
    this.rooms.export(tuning.id, format).subscribe({
      next: (blob) => {
        const url = URL.createObjectURL(blob);
        const link = document.createElement('a');
        link.href = url;
        link.download = `${tuning.name.replace(/[^\w.-]+/g, '-').replace(/^-+|-+$/g, '') || 'tuning'}-v${tuning.version}.${format}`;
        link.click();
        setTimeout(() => URL.revokeObjectURL(url), 1000);
      },
      error: (error: unknown) => this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 10000 }),
    });
  }

  protected compare(): void {
    if (!this.left() || !this.right()) return;
    this.comparing.set(true);
    this.rooms.compare(this.left(), this.right()).subscribe({
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
