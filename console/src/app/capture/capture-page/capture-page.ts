import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  computed,
  effect,
  inject,
  input,
  signal,
  untracked,
} from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { DEFAULT_SAMPLE_RATE_HZ, LABEL_MAX_LENGTH, LIMITS } from '../../../../../shared/limits';
import { formatQuantity } from '../../format/format';
import { errorMessage } from '../../problem/http-problem';
import { RoomsService } from '../../rooms/rooms.service';
import { responseChart } from '../../rooms/room-measurements/measurement-view';
import type { ImpulseResponseAnalysis } from '../../rooms/room-measurements/measurement.model';
import { ChartView } from '../../ui/chart/chart';
import { DecayPlotView } from '../../ui/decay-plot/decay-plot';
import { DecayRequestControl } from '../../ui/decay-plot/decay-request';
import {
  DEFAULT_DECAY_REQUEST,
  decayFormFields,
  decayRequestProblems,
} from '../../ui/decay-plot/decay-scale';
import { ImpulseResponseFacts } from '../../ui/ir-facts/ir-facts';
import { ConfirmDialog, ConfirmDialogData } from '../../ui/confirm-dialog/confirm-dialog';
import { AudioCapture, inputRefusal } from '../audio-capture';
import { CaptureService, SweepSettings } from '../capture.service';
import { encodeFloatWav } from '../wav-encode';

type RowStatus = 'waiting' | 'playing' | 'analysing' | 'done' | 'failed';

/** One loudspeaker of the pass: whether it is measured, on which output, and how its take went. */
interface CaptureRow {
  channel: string;
  name: string;
  include: boolean;
  /** 1-based output channel of the interface. */
  output: number;
  status: RowStatus;
  message: string;
  analysis: ImpulseResponseAnalysis | null;
  measurementId: string | null;
}

const STATUS_WORDS: Record<RowStatus, string> = {
  waiting: 'Not measured',
  playing: 'Playing and recording…',
  analysing: 'Analysing…',
  done: 'Measured',
  failed: 'Failed',
};

/** The meter's floor: quieter than this reads as silence. */
const METER_FLOOR_DB = -90;
/** The sweep level the API accepts with a recording (`SweepRecordingUpload.levelDbfs`). */
const SWEEP_LEVEL_DBFS = LIMITS['SweepRecordingUpload.levelDbfs'];

/**
 * Measuring a stored room from the browser: the input (microphone, and a loopback for timing), the
 * output channel each loudspeaker is wired to, a live input meter, a confirmation with the test
 * signal's cautions, then the sweep played through Web Audio on each chosen channel in turn while the
 * input records, each take stored as a measurement of its channel and its analysis shown.
 */
@Component({
  selector: 'iso-capture-page',
  imports: [
    ChartView,
    DecayPlotView,
    DecayRequestControl,
    ImpulseResponseFacts,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    RouterLink,
  ],
  templateUrl: './capture-page.html',
  styleUrl: './capture-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CapturePage {
  private readonly rooms = inject(RoomsService);
  private readonly captureApi = inject(CaptureService);
  private readonly dialog = inject(MatDialog);

  readonly roomId = input.required<string>();

  private readonly roomResource = rxResource({
    params: () => this.roomId(),
    stream: ({ params }) => this.rooms.room(params),
  });
  protected readonly room = computed(() => (this.roomResource.hasValue() ? this.roomResource.value() : null));
  protected readonly roomError = computed(() => {
    const error = this.roomResource.error();
    return error ? errorMessage(error) : null;
  });

  // What the browser offers.
  protected readonly secure = typeof window !== 'undefined' && window.isSecureContext;
  protected readonly hasMediaDevices =
    typeof navigator !== 'undefined' && Boolean(navigator.mediaDevices?.getUserMedia);
  protected readonly origin = typeof location !== 'undefined' ? location.origin : '';

  // The open input.
  private capture: AudioCapture | null = null;
  protected readonly inputOpen = signal(false);
  protected readonly opening = signal(false);
  protected readonly inputProblem = signal<{ title: string; advice: string } | null>(null);
  protected readonly inputs = signal<MediaDeviceInfo[]>([]);
  protected readonly outputs = signal<MediaDeviceInfo[]>([]);
  protected readonly inputId = signal('');
  protected readonly outputId = signal('');
  protected readonly inputChannels = signal(1);
  protected readonly outputChannels = signal(2);
  protected readonly sampleRateHz = signal(DEFAULT_SAMPLE_RATE_HZ);
  protected readonly micChannel = signal(0);
  protected readonly loopbackChannel = signal<number | null>(null);
  protected readonly levels = signal<number[]>([]);
  protected readonly canChooseOutput = signal(false);

  // The sweep.
  protected readonly levelDbfs = signal(-20);
  protected readonly levelBounds = SWEEP_LEVEL_DBFS;
  protected readonly micPositionMaxLength = LABEL_MAX_LENGTH;
  protected readonly durationS = signal(5);
  protected readonly tailS = signal(2);
  protected readonly micPosition = signal('MLP');
  protected readonly decayRequest = signal({ ...DEFAULT_DECAY_REQUEST });

  protected readonly rows = signal<CaptureRow[]>([]);
  protected readonly running = signal(false);
  protected readonly runProblem = signal<string | null>(null);
  protected readonly shownChannel = signal<string | null>(null);

  protected readonly inputChannelNumbers = computed(() =>
    Array.from({ length: this.inputChannels() }, (_, i) => i),
  );
  protected readonly chosenRows = computed(() => this.rows().filter((r) => r.include));
  protected readonly doneCount = computed(() => this.chosenRows().filter((r) => r.status === 'done').length);
  protected readonly progress = computed(() => {
    const chosen = this.chosenRows().length;
    return chosen ? (100 * this.doneCount()) / chosen : 0;
  });
  protected readonly settingsProblem = computed(() => {
    if (this.loopbackChannel() !== null && this.loopbackChannel() === this.micChannel())
      return 'The microphone and the loopback cannot be the same input channel.';
    const level = this.levelDbfs();
    if (!Number.isFinite(level) || level < SWEEP_LEVEL_DBFS.minimum || level > SWEEP_LEVEL_DBFS.maximum)
      return `Give a sweep level from ${String(SWEEP_LEVEL_DBFS.minimum).replace('-', '\u2212')} to ${SWEEP_LEVEL_DBFS.maximum} dBFS.`;
    const duration = this.durationS();
    if (!Number.isFinite(duration) || duration < 0.5 || duration > 30)
      return 'Give a sweep length from 0.5 to 30 s.';
    const tail = this.tailS();
    if (!Number.isFinite(tail) || tail < 0.5 || tail > 10) return 'Give a decay time from 0.5 to 10 s.';
    if (!this.micPosition().trim()) return 'Name the microphone position (e.g. MLP).';
    const decay = decayRequestProblems(this.decayRequest());
    if (decay.slices || decay.bins) return `Decay plots: ${decay.slices ?? decay.bins}`;
    if (this.sampleRateHz() < 44100)
      return `The browser's audio runs at ${this.sampleRateHz()} Hz; measuring needs 44.1 kHz or more. Set the interface to 48 kHz.`;
    return null;
  });

  protected readonly shown = computed(() => {
    const channel = this.shownChannel();
    return this.rows().find((r) => r.channel === channel && r.analysis) ?? null;
  });
  protected readonly chart = computed(() => {
    const row = this.shown();
    const response = row?.analysis?.frequencyResponse;
    if (!row || !response) return null;
    return responseChart({
      measured: { label: `${row.channel}: swept at ${this.micPosition().trim()}`, ...response },
    });
  });

  protected readonly statusWords = STATUS_WORDS;
  protected readonly formatQuantity = formatQuantity;
  private meterTimer: ReturnType<typeof setInterval> | null = null;

  constructor() {
    effect(() => this.fillRows());
    inject(DestroyRef).onDestroy(() => {
      if (this.meterTimer) clearInterval(this.meterTimer);
      void this.capture?.close();
    });
  }

  /** Rows follow the room's loudspeakers, output channels in layout order. */
  private fillRows(): void {
    const room = this.room();
    if (room && untracked(() => this.rows().length) === 0 && room.loudspeakers.length) {
      this.rows.set(
        room.loudspeakers.map((speaker, i) => ({
          channel: speaker.id,
          name: speaker.name ?? '',
          include: true,
          output: i + 1,
          status: 'waiting' as RowStatus,
          message: '',
          analysis: null,
          measurementId: null,
        })),
      );
    }
  }

  protected async openInput(): Promise<void> {
    this.opening.set(true);
    this.inputProblem.set(null);
    try {
      await this.capture?.close();
      if (this.meterTimer) clearInterval(this.meterTimer);
      const capture = await AudioCapture.open(this.inputId());
      this.capture = capture;
      this.inputChannels.set(capture.inputChannels);
      this.outputChannels.set(capture.outputChannels);
      this.sampleRateHz.set(capture.context.sampleRate);
      if (this.micChannel() >= capture.inputChannels) this.micChannel.set(0);
      if ((this.loopbackChannel() ?? 0) >= capture.inputChannels) this.loopbackChannel.set(null);
      this.canChooseOutput.set('setSinkId' in AudioContext.prototype);
      // Device names are only listed once the browser has been given an input.
      const devices = await navigator.mediaDevices.enumerateDevices();
      this.inputs.set(devices.filter((d) => d.kind === 'audioinput'));
      this.outputs.set(devices.filter((d) => d.kind === 'audiooutput'));
      this.inputOpen.set(true);
      this.meterTimer = setInterval(() => this.levels.set(capture.levels()), 100);
    } catch (error) {
      this.inputOpen.set(false);
      this.inputProblem.set(inputRefusal(error));
    } finally {
      this.opening.set(false);
    }
  }

  protected async chooseInput(id: string): Promise<void> {
    this.inputId.set(id);
    await this.openInput();
  }

  protected async chooseOutput(id: string): Promise<void> {
    this.outputId.set(id);
    try {
      await this.capture?.useOutput(id);
    } catch (error) {
      this.runProblem.set(`The browser could not switch the output: ${errorMessage(error)}`);
    }
  }

  /** A meter's fill, 0–100 %, from −90 to 0 dBFS. */
  protected meterPercent(db: number): number {
    if (!Number.isFinite(db)) return 0;
    return Math.max(0, Math.min(100, ((db - METER_FLOOR_DB) / -METER_FLOOR_DB) * 100));
  }

  protected meterText(db: number): string {
    return Number.isFinite(db) && db > METER_FLOOR_DB ? formatQuantity(db, 'dBFS', 1) : 'silence';
  }

  protected numberFrom(event: Event): number {
    return Number((event.target as HTMLInputElement).value);
  }

  protected updateRow(channel: string, change: Partial<CaptureRow>): void {
    this.rows.update((rows) => rows.map((r) => (r.channel === channel ? { ...r, ...change } : r)));
  }

  private sweep(): SweepSettings {
    const rate = this.sampleRateHz();
    return {
      sampleRateHz: rate,
      startHz: 20,
      // 20 kHz, or just under half the rate the browser runs at.
      endHz: Math.min(20000, Math.floor(rate * 0.45)),
      durationS: this.durationS(),
      fadeInS: 0.05,
      fadeOutS: 0.01,
      levelDbfs: this.levelDbfs(),
    };
  }

  /** Measures the chosen channels one after another (or only `only`), after one confirmation. */
  protected async measure(only?: string): Promise<void> {
    const capture = this.capture;
    if (!capture || this.running() || this.settingsProblem()) return;
    const targets = this.rows().filter((r) => (only ? r.channel === only : r.include));
    if (!targets.length) return;
    this.runProblem.set(null);
    const sweep = this.sweep();
    let description;
    try {
      description = await firstValueFrom(this.captureApi.describe(sweep));
    } catch (error) {
      this.runProblem.set(errorMessage(error));
      return;
    }
    const list = targets.map((r) => `${r.channel} on output ${r.output}`).join(', ');
    const data: ConfirmDialogData = {
      title: 'Play the sweep now?',
      message: `${description.cautions.map((c) => c.message).join(' ')} ${
        targets.length === 1
          ? `It plays once, ${formatQuantity(sweep.durationS, 's', 1)} long: ${list}.`
          : `It plays ${targets.length} times, ${formatQuantity(sweep.durationS, 's', 1)} each, one channel after another: ${list}.`
      }`,
      confirmLabel: 'Play and record',
    };
    const confirmed = await firstValueFrom(
      this.dialog.open(ConfirmDialog, { data, maxWidth: '94vw', width: '560px' }).afterClosed(),
    );
    if (confirmed !== true) return;

    this.running.set(true);
    try {
      const wav = await firstValueFrom(this.captureApi.sweepWav(sweep));
      const buffer = await capture.context.decodeAudioData(wav.slice(0));
      const room = this.room();
      for (const target of targets) {
        if (!room) break;
        this.updateRow(target.channel, { status: 'playing', message: '' });
        try {
          const take = await capture.take(buffer, target.output - 1, this.tailS());
          this.updateRow(target.channel, { status: 'analysing' });
          const loopback = this.loopbackChannel();
          const recorded = [
            take.channels[this.micChannel()],
            ...(loopback !== null ? [take.channels[loopback]] : []),
          ];
          const file = encodeFloatWav(recorded, take.sampleRateHz);
          const result = await firstValueFrom(
            this.captureApi.storeTake(
              room.id,
              target.channel,
              this.micPosition().trim(),
              file,
              sweep,
              loopback !== null ? 1 : null,
              decayFormFields(this.decayRequest()),
            ),
          );
          this.updateRow(target.channel, {
            status: 'done',
            analysis: result.analysis,
            measurementId: result.stored?.id ?? null,
            message: result.stored
              ? 'Stored as a measurement of this channel.'
              : 'Analysed; this server does not store recorded sweeps yet, so it was not stored.',
          });
          this.shownChannel.set(target.channel);
        } catch (error) {
          this.updateRow(target.channel, { status: 'failed', message: errorMessage(error) });
        }
      }
    } catch (error) {
      this.runProblem.set(errorMessage(error));
    } finally {
      this.running.set(false);
    }
  }

  protected arrivalText(row: CaptureRow): string {
    const analysis = row.analysis;
    if (!analysis) return '—';
    const fromReference = analysis.timing?.arrivalFromReferenceMs;
    return fromReference !== undefined
      ? `${formatQuantity(fromReference, 'ms', 2)} after the loopback`
      : formatQuantity(analysis.arrival.arrivalMs, 'ms', 2);
  }
}
