import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  output,
  signal,
  untracked,
} from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import {
  AbstractControl,
  FormArray,
  FormControl,
  FormGroup,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { ErrorStateMatcher, ShowOnDirtyErrorStateMatcher } from '@angular/material/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { startWith } from 'rxjs';
import { FILTER_LIMITS } from '../../../../../shared/filters/biquad-design';
import { LIMITS, MAX_FREQUENCY_HZ, NAME_MAX_LENGTH } from '../../../../../shared/limits';
import { channelCorrection, channelLimitProblems } from '../../../../../shared/plan/channel-edit';
import { TUNING_LIMITS } from '../../../../../shared/plan/tuning';
import { CalculationInputError } from '../../../../../shared/errors';
import { formatQuantity } from '../../format/format';
import type { FieldProblem } from '../../problem/problem-message';
import { ChartView } from '../../ui/chart/chart';
import type { ProcessorProfile } from '../../rooms/room.model';
import type {
  CrossoverFamily,
  FilterSpec,
  FilterType,
  ProcessorLimits,
  Tuning,
  TuningChannel,
  TuningChannelInput,
} from '../tuning.model';
import { FILTER_TYPE_LABELS, GAIN_TYPES, correctionChart, limitsSummary } from '../tuning-view';

type BandForm = FormGroup<{
  type: FormControl<FilterType>;
  frequencyHz: FormControl<number>;
  gainDb: FormControl<number>;
  q: FormControl<number>;
}>;

const num = (value: unknown): number => (typeof value === 'number' ? value : Number(value));

/**
 * Stored values can carry binary noise (−1.5999999 dB); the form shows them at a precision finer than
 * any processor takes — 0.1 µs of delay, 0.01 dB, 0.01 Hz, Q to 0.001.
 */
const round = (value: number, digits: number): number => Number(value.toFixed(digits));

/**
 * Edits one channel of a tuning: delay, trim, polarity, high-pass, bass management and EQ bands, with
 * the response of the settings drawn as they are typed and the room's limits checked at every change.
 * Limits and the physics checks come from shared/ (channelLimitProblems, channelCorrection); the API's
 * own refusals arrive through `serverErrors` and are shown on the field they name.
 */
@Component({
  selector: 'iso-channel-editor',
  imports: [
    ChartView,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    ReactiveFormsModule,
  ],
  templateUrl: './channel-editor.html',
  styleUrl: './channel-editor.scss',
  providers: [{ provide: ErrorStateMatcher, useClass: ShowOnDirtyErrorStateMatcher }],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChannelEditor {
  private readonly fb = inject(NonNullableFormBuilder);

  readonly channel = input.required<TuningChannel>();
  readonly subwoofer = input<Tuning['subwoofer']>(null);
  readonly sampleRateHz = input.required<number>();
  readonly limits = input<ProcessorLimits | null | undefined>(null);
  readonly profile = input<ProcessorProfile | null>(null);
  readonly readOnly = input(false);
  readonly saving = input(false);
  /** Field problems the API answered for this channel, pointers relative to it (`/eq/1/gainDb`). */
  readonly serverErrors = input<FieldProblem[]>([]);

  readonly save = output<TuningChannelInput>();
  readonly dirtyChange = output<boolean>();

  protected readonly filterTypes = Object.entries(FILTER_TYPE_LABELS) as Array<[FilterType, string]>;
  protected readonly bounds = {
    ...TUNING_LIMITS,
    ...FILTER_LIMITS,
    frequencyMaxHz: MAX_FREQUENCY_HZ,
    nameMaxLength: NAME_MAX_LENGTH,
    orderMin: LIMITS.order.minimum,
    orderMax: LIMITS.order.maximum,
  };
  protected readonly formatQuantity = formatQuantity;

  protected readonly form = this.fb.group({
    name: ['', Validators.maxLength(NAME_MAX_LENGTH)],
    delayMs: [0, [Validators.required, Validators.min(0), Validators.max(TUNING_LIMITS.delayMaxMs)]],
    trimDb: [
      0,
      [Validators.required, Validators.min(TUNING_LIMITS.trimMinDb), Validators.max(TUNING_LIMITS.trimMaxDb)],
    ],
    polarity: ['normal' as 'normal' | 'inverted'],
    bassManaged: [false],
    highPassFamily: ['none' as 'none' | CrossoverFamily],
    highPassOrder: [
      4,
      [Validators.required, Validators.min(LIMITS.order.minimum), Validators.max(LIMITS.order.maximum)],
    ],
    highPassHz: [80, [Validators.required, Validators.min(1), Validators.max(MAX_FREQUENCY_HZ)]],
    eq: this.fb.array<BandForm>([]),
  });

  private readonly formValue = toSignal(this.form.valueChanges.pipe(startWith(null)));
  private readonly loaded = signal(0);

  /** The channel as the form now describes it. */
  protected readonly draft = computed<TuningChannel>(() => {
    this.formValue();
    this.loaded();
    const value = this.form.getRawValue();
    const original = untracked(this.channel);
    return {
      id: original.id,
      ...(value.name.trim() ? { name: value.name.trim() } : {}),
      delayMs: num(value.delayMs),
      trimDb: num(value.trimDb),
      polarity: value.polarity,
      bassManaged: value.bassManaged,
      highPass:
        value.highPassFamily === 'none'
          ? null
          : {
              family: value.highPassFamily,
              order: num(value.highPassOrder),
              frequencyHz: num(value.highPassHz),
            },
      eq: value.eq.map((band, i) => this.bandSpec(band, original.eq[i])),
    };
  });

  protected readonly limitProblems = computed(() =>
    channelLimitProblems(this.draft(), this.sampleRateHz(), this.limits(), this.profile()),
  );
  protected readonly limitText = computed(() => limitsSummary(this.limits(), this.profile()?.name));

  /**
   * The response of the draft, or the field that cannot be designed at this rate. The signals are read
   * before anything else: a computed that returned early without reading them (while a field was empty)
   * would never run again, and every later physics refusal (a Linkwitz-Riley of odd order, a band above
   * Nyquist) would go unshown. The form's own errors are not signals; the draft changes with every edit.
   */
  private readonly designed = computed(() => {
    const draft = this.draft();
    const subwoofer = this.subwoofer() ?? null;
    const sampleRateHz = this.sampleRateHz();
    if (this.hasBoundErrors()) return { error: null, correction: null };
    try {
      return {
        error: null,
        correction: channelCorrection(draft, subwoofer, sampleRateHz),
      };
    } catch (error) {
      if (error instanceof CalculationInputError) return { error, correction: null };
      throw error;
    }
  });
  protected readonly chart = computed(() => {
    const correction = this.designed().correction;
    return correction ? correctionChart(correction, this.channel().id, this.limits()) : null;
  });
  protected readonly delaySamples = computed(() => this.designed().correction?.delaySamples ?? null);
  protected readonly bandLimit = computed(
    () => this.limits()?.eqBandsPerChannel ?? TUNING_LIMITS.eqMaxSections,
  );
  protected readonly dirty = signal(false);
  /** Problems that belong to no single field (the band count, a pointer the form has no field for). */
  protected readonly generalProblems = computed(() => {
    const general = this.limitProblems()
      .filter((p) => p.field === '/eq')
      .map((p) => p.message);
    for (const problem of this.serverErrors()) {
      if (!this.controlAt(problem.pointer)) general.push(problem.message);
    }
    return general;
  });
  protected readonly canSave = computed(() => {
    this.formValue();
    return (
      !this.readOnly() &&
      !this.saving() &&
      this.dirty() &&
      this.form.valid &&
      this.limitProblems().length === 0 &&
      this.designed().error === null
    );
  });

  constructor() {
    // A new channel (or a new version of it) resets the form.
    effect(() => {
      const channel = this.channel();
      untracked(() => this.load(channel));
    });
    effect(() => {
      const readOnly = this.readOnly();
      untracked(() => (readOnly ? this.form.disable({ emitEvent: false }) : this.enable()));
    });
    // Limits, physics and the API's answer land on the fields they name, as the person types.
    effect(() => {
      const limits = this.limitProblems();
      const physics = this.designed().error;
      const server = this.serverErrors();
      untracked(() => this.applyProblems(limits, physics, server));
    });
    this.form.valueChanges.subscribe(() => {
      if (this.form.dirty && !this.dirty()) {
        this.dirty.set(true);
        this.dirtyChange.emit(true);
      }
    });
  }

  protected get bands(): FormArray<BandForm> {
    return this.form.controls.eq;
  }

  protected hasGain(band: BandForm): boolean {
    return GAIN_TYPES.has(band.controls.type.value);
  }

  protected addBand(): void {
    const last = this.bands.at(this.bands.length - 1)?.getRawValue();
    this.bands.push(
      this.bandForm({
        type: 'peaking',
        frequencyHz: last ? Math.min(last.frequencyHz * 2, 16000) : 100,
        gainDb: -3,
        q: 2,
      }),
    );
    this.bands.markAsDirty();
  }

  protected removeBand(index: number): void {
    this.bands.removeAt(index);
    this.bands.markAsDirty();
  }

  protected typeChanged(band: BandForm): void {
    if (this.hasGain(band)) band.controls.gainDb.enable();
    else band.controls.gainDb.disable();
  }

  protected reset(): void {
    this.load(this.channel());
  }

  protected submit(): void {
    if (!this.canSave()) return;
    const draft = this.draft();
    this.save.emit({
      id: draft.id,
      ...(draft.name ? { name: draft.name } : {}),
      delayMs: draft.delayMs,
      trimDb: draft.trimDb,
      polarity: draft.polarity,
      bassManaged: draft.bassManaged,
      highPass: draft.highPass,
      eq: draft.eq,
    });
  }

  /** The message a field shows: the first of its errors, in words. */
  protected errorOf(control: AbstractControl): string {
    const errors = control.errors ?? {};
    if (errors['server']) return String(errors['server']);
    if (errors['limit']) return String(errors['limit']);
    if (errors['physics']) return String(errors['physics']);
    if (errors['required']) return 'Enter a number.';
    if (errors['min']) return `At least ${errors['min'].min}.`;
    if (errors['max']) return `At most ${errors['max'].max}.`;
    if (errors['maxlength']) return `At most ${errors['maxlength'].requiredLength} characters.`;
    return 'Check this value.';
  }

  private load(channel: TuningChannel): void {
    this.bands.clear({ emitEvent: false });
    for (const band of channel.eq) this.bands.push(this.bandForm(band), { emitEvent: false });
    this.form.reset(
      {
        name: channel.name ?? '',
        delayMs: round(channel.delayMs, 4),
        trimDb: round(channel.trimDb, 2),
        polarity: channel.polarity,
        bassManaged: channel.bassManaged,
        highPassFamily: channel.highPass?.family ?? 'none',
        highPassOrder: channel.highPass?.order ?? 4,
        highPassHz: round(channel.highPass?.frequencyHz ?? 80, 2),
        eq: channel.eq.map((band) => ({
          type: band.type,
          frequencyHz: round(band.frequencyHz, 2),
          gainDb: round(band.gainDb ?? 0, 2),
          q: round(band.q ?? Math.SQRT1_2, 3),
        })),
      },
      { emitEvent: false },
    );
    if (this.readOnly()) this.form.disable({ emitEvent: false });
    else this.enable();
    this.dirty.set(false);
    this.dirtyChange.emit(false);
    this.loaded.update((n) => n + 1);
  }

  private enable(): void {
    this.form.enable({ emitEvent: false });
    for (const band of this.bands.controls) this.typeChanged(band);
    this.highPassChanged();
  }

  protected highPassChanged(): void {
    const none = this.form.controls.highPassFamily.value === 'none';
    for (const control of [this.form.controls.highPassOrder, this.form.controls.highPassHz]) {
      if (none) control.disable({ emitEvent: false });
      else if (!this.readOnly()) control.enable({ emitEvent: false });
    }
  }

  private bandForm(band: Pick<FilterSpec, 'type' | 'frequencyHz' | 'gainDb' | 'q'>): BandForm {
    const form: BandForm = this.fb.group({
      type: [band.type],
      frequencyHz: [
        band.frequencyHz,
        [Validators.required, Validators.min(FILTER_LIMITS.frequencyMinHz), Validators.max(MAX_FREQUENCY_HZ)],
      ],
      gainDb: [
        band.gainDb ?? 0,
        [
          Validators.required,
          Validators.min(FILTER_LIMITS.gainMinDb),
          Validators.max(FILTER_LIMITS.gainMaxDb),
        ],
      ],
      q: [
        round(band.q ?? Math.SQRT1_2, 3),
        [Validators.required, Validators.min(FILTER_LIMITS.qMin), Validators.max(FILTER_LIMITS.qMax)],
      ],
    });
    if (!GAIN_TYPES.has(band.type)) form.controls.gainDb.disable({ emitEvent: false });
    return form;
  }

  /** A band as the API stores it; a width the form does not edit (octaves, shelf slope) is kept. */
  private bandSpec(
    band: { type: FilterType; frequencyHz: number; gainDb: number; q: number },
    original: FilterSpec | undefined,
  ): FilterSpec {
    const spec: FilterSpec = { type: band.type, frequencyHz: num(band.frequencyHz) };
    if (GAIN_TYPES.has(band.type)) spec.gainDb = num(band.gainDb);
    const keepWidth =
      original &&
      original.q === undefined &&
      original.type === band.type &&
      num(band.q) === round(Math.SQRT1_2, 3);
    if (keepWidth && original.bandwidthOctaves !== undefined)
      spec.bandwidthOctaves = original.bandwidthOctaves;
    else if (keepWidth && original.shelfSlope !== undefined) spec.shelfSlope = original.shelfSlope;
    else spec.q = num(band.q);
    return spec;
  }

  private hasBoundErrors(): boolean {
    const controls = [
      this.form.controls.delayMs,
      this.form.controls.trimDb,
      this.form.controls.highPassOrder,
    ];
    const bandControls = this.bands.controls.flatMap((band) => Object.values(band.controls));
    return [...controls, this.form.controls.highPassHz, ...bandControls].some((control) =>
      Object.keys(control.errors ?? {}).some((key) => !['server', 'limit', 'physics'].includes(key)),
    );
  }

  /** The form control a channel-relative pointer names (`/eq/1/gainDb`, `/highPass/frequencyHz`). */
  private controlAt(pointer: string): AbstractControl | null {
    const parts = pointer.split('/').filter(Boolean);
    const [first, second, third] = parts;
    if (first === 'eq' && second !== undefined) {
      const band = this.bands.at(Number(second));
      if (!band) return null;
      return third ? (band.get(third) ?? null) : band;
    }
    if (first === 'highPass') {
      return second === 'order'
        ? this.form.controls.highPassOrder
        : second === 'family'
          ? this.form.controls.highPassFamily
          : this.form.controls.highPassHz;
    }
    if (first && first in this.form.controls && first !== 'eq') return this.form.get(first);
    return null;
  }

  private applyProblems(
    limits: Array<{ field: string; message: string }>,
    physics: CalculationInputError | null,
    server: FieldProblem[],
  ): void {
    const all: Array<{ control: AbstractControl; key: string; message: string }> = [];
    for (const problem of limits) {
      const control = this.controlAt(problem.field);
      if (control && problem.field !== '/eq') all.push({ control, key: 'limit', message: problem.message });
    }
    if (physics) {
      const control = this.controlAt(physics.field);
      if (control)
        all.push({
          control,
          key: 'physics',
          message: `${physics.message[0].toUpperCase()}${physics.message.slice(1)}.`,
        });
    }
    for (const problem of server) {
      const control = this.controlAt(problem.pointer);
      if (control) all.push({ control, key: 'server', message: problem.message });
    }
    const touched = new Set(all.map((entry) => entry.control));
    // Clear what was set last time on fields that are fine now.
    const everything = [
      ...Object.values(this.form.controls).filter((c) => c !== this.form.controls.eq),
      ...this.bands.controls.flatMap((band) => Object.values(band.controls)),
    ];
    for (const control of everything) {
      const errors = control.errors;
      if (
        errors &&
        ('limit' in errors || 'physics' in errors || 'server' in errors) &&
        !touched.has(control)
      ) {
        control.updateValueAndValidity({ emitEvent: false, onlySelf: true });
      }
    }
    for (const control of touched) {
      control.updateValueAndValidity({ emitEvent: false, onlySelf: true });
      const own = control.errors ?? {};
      const extra = Object.fromEntries(
        all
          .filter((entry) => entry.control === control)
          .reverse() // the first problem found for a field is the one it shows
          .map((entry) => [entry.key, entry.message]),
      );
      control.setErrors({ ...own, ...extra }, { emitEvent: false });
      control.markAsDirty({ onlySelf: true });
    }
    this.form.updateValueAndValidity({ emitEvent: false });
  }
}
