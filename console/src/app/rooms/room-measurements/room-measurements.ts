import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { EMPTY, filter, map, switchMap } from 'rxjs';
import { Router } from '@angular/router';
import { SessionService } from '../../auth/session.service';
import { formatQuantity } from '../../format/format';
import { errorMessage, toProblem } from '../../problem/http-problem';
import { ReadableProblem } from '../../problem/problem-message';
import { ChartView } from '../../ui/chart/chart';
import { DecayPlotView } from '../../ui/decay-plot/decay-plot';
import { DecayRequestControl } from '../../ui/decay-plot/decay-request';
import {
  DEFAULT_DECAY_REQUEST,
  decayFormFields,
  decayRequestProblems,
} from '../../ui/decay-plot/decay-scale';
import { ImpulseResponseFacts } from '../../ui/ir-facts/ir-facts';
import { formatFrequency } from '../../ui/chart/frequency-ticks';
import { ConfirmDialog, ConfirmDialogData } from '../../ui/confirm-dialog/confirm-dialog';
import { Room } from '../room.model';
import {
  DEFAULT_SMOOTHING_OCTAVES,
  DraftProblem,
  FitChoices,
  SMOOTHING_CHOICES,
  WavFacts,
  decayRows,
  defaultBandCount,
  defaultSelection,
  eqFitRequest,
  fitChoiceProblems,
  maxBandCount,
  responseKinds,
  wavFacts,
  measuredLabel,
  measurementRows,
  modeRows,
  responseChart,
  uploadFieldErrors,
  uploadProblems,
} from './measurement-view';
import { ImpulseResponseAnalysis, Measurement, ResponseKind, impulseResponseOf } from './measurement.model';
import { MeasurementsService } from './measurements.service';
import { ApplyFitChoice, ApplyFitData, ApplyFitDialog } from './apply-fit-dialog';
import { RoomsService } from '../rooms.service';
import { TuningsService } from '../../tunings/tunings.service';
import { LABEL_MAX_LENGTH } from '../../../../../shared/limits';

/** How many of the lowest room modes the table lists. */
const MODE_TABLE_ROWS = 10;

/** Where the kind chosen for a channel's average is remembered, per room and channel. */
const KIND_STORAGE_PREFIX = 'isochron.averageKind';

function rememberedKind(roomId: string, channel: string): ResponseKind | null {
  try {
    const value = localStorage.getItem(`${KIND_STORAGE_PREFIX}.${roomId}.${channel}`);
    return value === 'impulseResponse' || value === 'frequencyResponse' ? value : null;
  } catch {
    return null;
  }
}

function rememberKind(roomId: string, channel: string, kind: ResponseKind): void {
  try {
    localStorage.setItem(`${KIND_STORAGE_PREFIX}.${roomId}.${channel}`, kind);
  } catch {
    // Storage refused (private mode, quota): the choice then lasts for this page only.
  }
}

/**
 * A room's measurements: the list with delete, an upload form, the measured (or spatially averaged)
 * response of the selected channel overlaid with the response predicted after a cut-first EQ fit, and
 * the selected impulse response's decay times, room modes and Schroeder frequency.
 */
@Component({
  selector: 'iso-room-measurements',
  imports: [
    ChartView,
    DecayPlotView,
    DecayRequestControl,
    ImpulseResponseFacts,
    MatButtonModule,
    MatButtonToggleModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
  ],
  templateUrl: './room-measurements.html',
  styleUrl: './room-measurements.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RoomMeasurements {
  private readonly service = inject(MeasurementsService);
  private readonly session = inject(SessionService);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly rooms = inject(RoomsService);
  private readonly tunings = inject(TuningsService);
  private readonly router = inject(Router);

  readonly room = input.required<Room>();

  protected readonly canUpload = computed(() => this.session.can('rooms:view'));

  private readonly listResource = rxResource({
    params: () => this.room().id,
    stream: ({ params }) => this.service.list(params),
  });
  protected readonly measurements = computed(() =>
    this.listResource.hasValue() ? this.listResource.value() : [],
  );
  protected readonly rows = computed(() => measurementRows(this.measurements()));
  protected readonly listError = computed(() => {
    const error = this.listResource.error();
    return error ? errorMessage(error) : null;
  });

  private readonly chosenId = signal<string | null>(null);
  /** The chosen measurement, or the newest impulse response when nothing (still present) was chosen. */
  protected readonly selectedId = computed(() => {
    const chosen = this.chosenId();
    const list = this.measurements();
    return chosen && list.some((m) => m.id === chosen) ? chosen : defaultSelection(list);
  });
  protected readonly selected = computed(
    () => this.measurements().find((m) => m.id === this.selectedId()) ?? null,
  );

  private readonly detailResource = rxResource({
    params: () => {
      const id = this.selectedId();
      return id ? { roomId: this.room().id, id } : undefined;
    },
    stream: ({ params }) => this.service.get(params.roomId, params.id),
  });
  protected readonly analysis = computed((): ImpulseResponseAnalysis | null => {
    if (!this.detailResource.hasValue()) return null;
    const detail = this.detailResource.value();
    return detail?.id === this.selectedId() ? impulseResponseOf(detail) : null;
  });

  /** Response kinds the selected channel has; with both, the panel asks which to average. */
  protected readonly channelKinds = computed(() => {
    const selected = this.selected();
    return selected ? responseKinds(this.measurements(), selected.channel) : [];
  });
  /** Choices made on this page, per channel; they are also remembered in the browser for next time. */
  private readonly kindChoices = signal<Record<string, ResponseKind>>({});
  /** The kind averaged for the selected channel: only one it has, else the choice made, else the selected row's. */
  protected readonly averageKind = computed((): ResponseKind | null => {
    const selected = this.selected();
    const kinds = this.channelKinds();
    if (!selected || !kinds.length) return null;
    if (kinds.length === 1) return kinds[0];
    const chosen = this.kindChoices()[selected.channel] ?? rememberedKind(this.room().id, selected.channel);
    if (chosen && kinds.includes(chosen)) return chosen;
    return selected.kind === 'spl' ? kinds[0] : (selected.kind as ResponseKind);
  });

  protected chooseKind(kind: ResponseKind): void {
    const selected = this.selected();
    if (!selected) return;
    this.kindChoices.update((choices) => ({ ...choices, [selected.channel]: kind }));
    rememberKind(this.room().id, selected.channel, kind);
  }

  /** The response the plot shows: the power average of the selected channel over its positions. */
  private readonly averageResource = rxResource({
    params: () => {
      const selected = this.selected();
      if (!selected || selected.kind === 'spl') return undefined;
      const kind = this.averageKind();
      // The ids make the average follow uploads and deletions of this channel.
      const ids = this.measurements()
        .filter((m) => m.channel === selected.channel && m.kind !== 'spl')
        .map((m) => m.id)
        .join();
      return {
        roomId: this.room().id,
        channel: selected.channel,
        ids,
        kind: this.channelKinds().length > 1 ? kind : null,
      };
    },
    stream: ({ params }) => this.service.average(params.roomId, params.channel, params.kind ?? undefined),
  });
  protected readonly average = computed(() =>
    this.averageResource.hasValue() ? (this.averageResource.value() ?? null) : null,
  );

  protected readonly allowBoost = signal(false);
  protected readonly maxBoostDb = computed(() => this.room().limits?.['eqMaxBoostDb'] ?? 0);

  // Fit controls: empty range fields leave the ends to the API (the response's lowest point and the
  // room's transition frequency); the band count starts at the room's bands per channel.
  protected readonly fitFromHz = signal<number | null>(null);
  protected readonly fitToHz = signal<number | null>(null);
  protected readonly fitTargetName = signal<string | null>(null);
  protected readonly fitBands = signal<number | null>(null);
  protected readonly defaultBands = computed(() => defaultBandCount(this.room().limits));
  protected readonly mostBands = computed(() => maxBandCount(this.room().limits));
  protected readonly micPositionMaxLength = LABEL_MAX_LENGTH;
  private readonly fitChoices = computed((): FitChoices => ({
    fromHz: this.fitFromHz(),
    toHz: this.fitToHz(),
    targetName: this.fitTargetName(),
    maxBands: this.fitBands(),
  }));
  protected readonly fitProblems = computed(() => fitChoiceProblems(this.fitChoices(), this.room().limits));
  protected fitProblemFor(field: 'fromHz' | 'toHz' | 'maxBands'): string | null {
    return this.fitProblems().find((p) => p.field === field)?.message ?? null;
  }
  protected readonly fitIsDefault = computed(
    () =>
      this.fitFromHz() === null &&
      this.fitToHz() === null &&
      this.fitTargetName() === null &&
      this.fitBands() === null &&
      !this.allowBoost(),
  );

  private readonly targetCurvesResource = rxResource({
    stream: () => this.service.targetCurves(),
  });
  /** Stored target curves; none (only flat) when the list cannot be read. */
  protected readonly targetCurves = computed(() =>
    this.targetCurvesResource.hasValue() ? (this.targetCurvesResource.value() ?? []) : [],
  );

  /** A number field's value, or null when it is empty (the default applies). */
  protected numberOrNull(event: Event): number | null {
    const text = (event.target as HTMLInputElement).value.trim();
    return text === '' ? null : Number(text);
  }

  protected resetFit(): void {
    this.fitFromHz.set(null);
    this.fitToHz.set(null);
    this.fitTargetName.set(null);
    this.fitBands.set(null);
    this.allowBoost.set(false);
  }

  private readonly fitResource = rxResource({
    params: () => {
      const average = this.average();
      if (!average || this.fitProblems().length) return undefined;
      const { widthM, lengthM, heightM } = this.room().dimensions;
      // The selected impulse response's T30 (else T20) sets the transition frequency; 0.3 s is assumed without one.
      const decay = this.selected()?.channel === average.channel ? this.analysis()?.decay : undefined;
      return eqFitRequest(
        average,
        this.room().limits,
        this.room().sampleRateHz,
        this.allowBoost(),
        { volumeM3: widthM * lengthM * heightM, reverberationTimeS: decay?.t30S ?? decay?.t20S ?? null },
        this.fitChoices(),
      );
    },
    stream: ({ params }) => this.service.fitEq(params),
  });
  protected readonly fit = computed(() =>
    this.fitResource.hasValue() ? (this.fitResource.value() ?? null) : null,
  );
  protected readonly plotError = computed(() => {
    const error = this.averageResource.error() ?? this.fitResource.error() ?? this.detailResource.error();
    return error ? errorMessage(error) : null;
  });
  protected readonly plotLoading = computed(
    () => this.averageResource.isLoading() || this.fitResource.isLoading() || this.detailResource.isLoading(),
  );

  protected readonly chart = computed(() => {
    const average = this.average();
    if (!average) return null;
    const analysis = this.analysis();
    const sameChannel = this.selected()?.channel === average.channel;
    const targetName = this.fitTargetName();
    const target = targetName ? (this.targetCurves().find((c) => c.name === targetName) ?? null) : null;
    return responseChart({
      measured: { label: measuredLabel(average.channel, average.micPositions), ...average },
      fit: this.fit(),
      target,
      modes: sameChannel ? analysis?.room?.modes : undefined,
      schroederFrequencyHz: sameChannel ? analysis?.room?.schroederFrequencyHz : undefined,
    });
  });
  protected readonly decay = computed(() => {
    const analysis = this.analysis();
    if (!analysis) return [];
    const { edtS, t20S, t30S, bands } = analysis.decay;
    return decayRows({ edtS, t20S, t30S, centreHz: 0, nominalHz: 0 }, bands);
  });
  protected readonly modes = computed(() => modeRows(this.analysis()?.room?.modes ?? [], MODE_TABLE_ROWS));

  // Upload form.
  protected readonly channel = signal('');
  protected readonly micPosition = signal('MLP');
  protected readonly file = signal<File | null>(null);
  /** The chosen WAV's channel count and rate (read in the browser), null for a text file. */
  protected readonly fileFacts = signal<WavFacts | null>(null);
  protected readonly fileChannel = signal<number | null>(null);
  protected readonly referenceFileChannel = signal<number | null>(null);
  protected readonly smoothingOctaves = signal(DEFAULT_SMOOTHING_OCTAVES);
  protected readonly smoothingChoices = SMOOTHING_CHOICES;
  protected readonly decayRequest = signal({ ...DEFAULT_DECAY_REQUEST });
  protected readonly fileChannelNumbers = computed(() =>
    Array.from({ length: this.fileFacts()?.channelCount ?? 0 }, (_, i) => i),
  );
  protected readonly submitted = signal(false);
  protected readonly uploading = signal(false);
  protected readonly uploadProblem = signal<ReadableProblem | null>(null);
  protected readonly uploadFieldErrors = computed(() => {
    const problem = this.uploadProblem();
    return problem ? uploadFieldErrors(problem.detail, problem.fieldErrors) : [];
  });
  protected readonly draftProblems = computed(() =>
    uploadProblems(
      {
        channel: this.channel(),
        micPosition: this.micPosition(),
        file: this.file(),
        fileChannels: this.fileFacts()?.channelCount,
        fileChannel: this.fileChannel(),
        referenceFileChannel: this.referenceFileChannel(),
      },
      this.room().loudspeakers.map((l) => l.id),
    ),
  );
  protected problemFor(field: DraftProblem['field']): string | null {
    if (!this.submitted()) return null;
    return this.draftProblems().find((p) => p.field === field)?.message ?? null;
  }

  protected readonly formatQuantity = formatQuantity;
  protected readonly formatFrequency = formatFrequency;

  /** Shows a measurement's channel; with both kinds stored, the row's kind becomes the one averaged. */
  protected select(id: string): void {
    this.chosenId.set(id);
    const chosen = this.measurements().find((m) => m.id === id);
    if (chosen && chosen.kind !== 'spl' && responseKinds(this.measurements(), chosen.channel).length > 1)
      this.chooseKind(chosen.kind);
  }

  protected onFile(event: Event): void {
    const files = (event.target as HTMLInputElement).files;
    const file = files && files.length ? files[0] : null;
    this.file.set(file);
    this.fileFacts.set(null);
    this.fileChannel.set(null);
    this.referenceFileChannel.set(null);
    this.uploadProblem.set(null);
    if (!file) return;
    // The whole file (at most 20 MiB) is read: the RIFF walker checks every chunk size against it.
    void file.arrayBuffer().then((buffer) => {
      if (this.file() !== file) return;
      const facts = wavFacts(new Uint8Array(buffer));
      this.fileFacts.set(facts);
      if (facts && facts.channelCount === 1) this.fileChannel.set(null);
    });
  }

  protected upload(fileInput: HTMLInputElement): void {
    this.submitted.set(true);
    this.uploadProblem.set(null);
    const file = this.file();
    if (this.draftProblems().length || !file) return;
    if (Object.keys(decayRequestProblems(this.decayRequest())).length) return;
    this.uploading.set(true);
    const facts = this.fileFacts();
    const multichannel = (facts?.channelCount ?? 1) > 1;
    const options = facts
      ? {
          smoothingOctaves: this.smoothingOctaves(),
          decayFields: decayFormFields(this.decayRequest()),
          ...(multichannel && { fileChannel: this.fileChannel() ?? 0 }),
          ...(multichannel &&
            this.referenceFileChannel() !== null && {
              referenceFileChannel: this.referenceFileChannel() ?? 0,
            }),
        }
      : {};
    this.service.upload(this.room().id, this.channel(), this.micPosition().trim(), file, options).subscribe({
      next: (stored) => {
        this.uploading.set(false);
        this.submitted.set(false);
        this.file.set(null);
        this.fileFacts.set(null);
        this.fileChannel.set(null);
        this.referenceFileChannel.set(null);
        fileInput.value = '';
        this.chosenId.set(stored.id);
        this.listResource.reload();
        this.snackBar.open(`Stored ${stored.channel} at ${stored.micPosition}.`, undefined, {
          duration: 4000,
        });
      },
      error: (error: unknown) => {
        this.uploading.set(false);
        this.uploadProblem.set(toProblem(error));
      },
    });
  }

  /** The fitted bands into one channel of one of the room's tunings, as a new version. */
  protected applyFit(): void {
    const fit = this.fit();
    const selected = this.selected();
    if (!fit || !selected || !fit.bands.length) return;
    this.rooms
      .tunings(this.room().id)
      .pipe(
        switchMap((tunings) => {
          if (!tunings.length) {
            this.snackBar.open('This room has no tuning yet: start one with New tuning above.', 'Dismiss', {
              duration: 8000,
            });
            return EMPTY;
          }
          return this.dialog
            .open<ApplyFitDialog, ApplyFitData, ApplyFitChoice>(ApplyFitDialog, {
              data: { tunings, channel: selected.channel, bandCount: fit.bands.length },
              width: '480px',
              maxWidth: '94vw',
            })
            .afterClosed();
        }),
        filter((choice): choice is ApplyFitChoice => Boolean(choice)),
        switchMap((choice) =>
          this.tunings
            .update(choice.tuningId, { channels: [{ id: choice.channel, eq: fit.bands }] })
            .pipe(map((tuning) => ({ tuning, choice }))),
        ),
      )
      .subscribe({
        next: ({ tuning, choice }) => {
          this.snackBar
            .open(
              `Fitted EQ applied to ${choice.channel} of “${tuning.name}”, version ${tuning.version}.`,
              'Open',
              {
                duration: 8000,
              },
            )
            .onAction()
            .subscribe(() => void this.router.navigate(['/rooms', this.room().id, 'tunings', tuning.id]));
        },
        error: (error: unknown) => this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 12000 }),
      });
  }

  protected remove(measurement: Measurement): void {
    const data: ConfirmDialogData = {
      title: 'Delete this measurement?',
      message: `${measurement.channel} at microphone position ${measurement.micPosition} will be deleted with its analysis. This cannot be undone.`,
      confirmLabel: 'Delete measurement',
      destructive: true,
    };
    this.dialog
      .open(ConfirmDialog, { data, maxWidth: '94vw' })
      .afterClosed()
      .pipe(
        filter((confirmed) => confirmed === true),
        switchMap(() => this.service.delete(this.room().id, measurement.id)),
        map(() => measurement),
      )
      .subscribe({
        next: () => {
          this.listResource.reload();
          this.snackBar.open(`Deleted ${measurement.channel} at ${measurement.micPosition}.`, undefined, {
            duration: 4000,
          });
        },
        error: (error: unknown) => this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 10000 }),
      });
  }

  protected measurementById(id: string): Measurement | null {
    return this.measurements().find((m) => m.id === id) ?? null;
  }

  protected reload(): void {
    this.listResource.reload();
  }
}
