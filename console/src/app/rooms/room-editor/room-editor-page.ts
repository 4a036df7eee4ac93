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
import { rxResource, toSignal } from '@angular/core/rxjs-interop';
import {
  AbstractControl,
  FormControl,
  FormGroup,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import { of, startWith } from 'rxjs';
import { roomGeometry } from '../../../../../shared/geometry/room';
import { placeLayoutLoudspeakers } from '../../../../../shared/geometry/place-layout';
import {
  DEFAULT_SAMPLE_RATE_HZ,
  LABEL_MAX_LENGTH,
  LIMITS,
  NAME_MAX_LENGTH,
  SAMPLE_RATE_MAX_HZ,
  SAMPLE_RATE_MIN_HZ,
} from '../../../../../shared/limits';
import { COMMON_SAMPLE_RATES_HZ } from '../../sample-rates';
import { notBlank } from '../../tunings/tuning-details-dialog';
import { formatQuantity } from '../../format/format';
import { errorMessage, toProblem } from '../../problem/http-problem';
import type { Layout, Room, RoomCreate } from '../room.model';
import { formPathOf, layoutLabel, limitsOf, mm } from '../room-form';
import { RoomsService } from '../rooms.service';
import { PlanEditor, type PlanMove } from './plan-editor';

type SpeakerForm = FormGroup<{
  id: FormControl<string>;
  name: FormControl<string>;
  x: FormControl<number>;
  y: FormControl<number>;
  z: FormControl<number>;
}>;

const metres = [Validators.required, Validators.min(LIMITS.x.minimum), Validators.max(LIMITS.x.maximum)];
// At least the smallest room whose modes are computed, at most the largest stored room.
const roomSide = [
  Validators.required,
  Validators.min(LIMITS.roomWidthM.minimum),
  Validators.max(LIMITS.widthM.maximum),
];
/** A processor limit field: empty (no limit) or within its contract bound. */
const limitField = (bound: { minimum: number; maximum: number }) => [
  Validators.min(bound.minimum),
  Validators.max(bound.maximum),
];

/**
 * Creates or edits a room: layout, dimensions, listening position, loudspeakers placed at the layout's
 * nominal angles in one step and then adjusted in a table, the processor's limits and sample rate. The
 * top view and the angle check follow the numbers as they are typed (shared/geometry); the API's own
 * refusals are shown on the field they name.
 */
@Component({
  selector: 'iso-room-editor-page',
  imports: [
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    PlanEditor,
    ReactiveFormsModule,
    RouterLink,
  ],
  templateUrl: './room-editor-page.html',
  styleUrl: './room-editor-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RoomEditorPage {
  private readonly rooms = inject(RoomsService);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);

  /** Absent for a new room. */
  readonly roomId = input<string | undefined>();

  private readonly roomResource = rxResource({
    params: () => this.roomId(),
    stream: ({ params }) => (params ? this.rooms.room(params) : of(null)),
  });
  private readonly layoutsResource = rxResource({ stream: () => this.rooms.layouts() });
  private readonly profilesResource = rxResource({ stream: () => this.rooms.profiles() });
  protected readonly profiles = computed(() =>
    this.profilesResource.hasValue() ? this.profilesResource.value() : [],
  );

  protected readonly layouts = computed(() =>
    this.layoutsResource.hasValue() ? this.layoutsResource.value() : [],
  );
  protected readonly existing = computed(() =>
    this.roomResource.hasValue() ? this.roomResource.value() : null,
  );
  protected readonly loading = computed(
    () => this.roomResource.isLoading() || this.layoutsResource.isLoading(),
  );
  protected readonly loadError = computed(() => {
    const error = this.roomResource.error() ?? this.layoutsResource.error();
    return error ? toProblem(error) : null;
  });
  protected readonly saving = signal(false);
  protected readonly saveProblem = signal<string | null>(null);
  protected readonly layoutLabel = layoutLabel;
  protected readonly formatQuantity = formatQuantity;
  protected readonly nameMaxLength = NAME_MAX_LENGTH;
  protected readonly notesMaxLength = LIMITS['RoomCreate.notes'].maxLength;
  protected readonly sampleRates = COMMON_SAMPLE_RATES_HZ;

  protected readonly form = this.fb.group({
    name: ['', [Validators.required, notBlank, Validators.maxLength(NAME_MAX_LENGTH)]],
    layout: ['bs2051-j', Validators.required],
    dimensions: this.fb.group({
      widthM: [6, roomSide],
      lengthM: [7, roomSide],
      heightM: [3, roomSide],
    }),
    listener: this.fb.group({ x: [3, metres], y: [3.5, metres], z: [1.2, metres] }),
    placeDistanceM: [2.5, [Validators.required, Validators.min(0.3), Validators.max(50)]],
    loudspeakers: this.fb.array<SpeakerForm>([]),
    limits: this.fb.group({
      delayMaxMs: this.fb.control<number | null>(null, limitField(LIMITS.delayMaxMs)),
      trimMinDb: this.fb.control<number | null>(null, limitField(LIMITS.trimMinDb)),
      trimMaxDb: this.fb.control<number | null>(null, limitField(LIMITS.trimMaxDb)),
      eqBandsPerChannel: this.fb.control<number | null>(null, limitField(LIMITS.eqBandsPerChannel)),
      eqMaxBoostDb: this.fb.control<number | null>(null, limitField(LIMITS['Limits.eqMaxBoostDb'])),
      eqMaxCutDb: this.fb.control<number | null>(null, limitField(LIMITS.eqMaxCutDb)),
    }),
    sampleRateHz: [
      DEFAULT_SAMPLE_RATE_HZ,
      [Validators.required, Validators.min(SAMPLE_RATE_MIN_HZ), Validators.max(SAMPLE_RATE_MAX_HZ)],
    ],
    profileId: this.fb.control<string | null>(null),
    notes: ['', Validators.maxLength(LIMITS['RoomCreate.notes'].maxLength)],
  });

  private readonly value = toSignal(this.form.valueChanges.pipe(startWith(null)));

  protected readonly layout = computed<Layout | null>(() => {
    this.value();
    return this.layouts().find((layout) => layout.id === this.form.controls.layout.value) ?? null;
  });

  /** Distances, angles and the range check of what is typed now; null while a number is missing. */
  protected readonly geometry = computed(() => {
    this.value();
    const room = this.roomDraft();
    if (!room) return null;
    try {
      return roomGeometry(room);
    } catch {
      return null;
    }
  });
  /** What the plan draws: the draft while every position is a number. */
  protected readonly plan = computed(() => {
    this.value();
    return this.roomDraft();
  });
  protected readonly missingChannels = computed(() => {
    const layout = this.layout();
    this.value();
    const ids = new Set(this.speakers.controls.map((speaker) => speaker.controls.id.value));
    return layout ? layout.channels.filter((channel) => !ids.has(channel.label)).map((c) => c.label) : [];
  });

  constructor() {
    effect(() => {
      const room = this.existing();
      if (room) untracked(() => this.load(room));
    });
    this.form.valueChanges.subscribe(() => this.saveProblem.set(null));
  }

  protected get speakers() {
    return this.form.controls.loudspeakers;
  }

  protected geometryOf(id: string) {
    return this.geometry()?.speakers.find((speaker) => speaker.id === id) ?? null;
  }

  /** Every loudspeaker of the layout at its nominal direction, the chosen distance from the listener. */
  protected place(): void {
    const layout = this.layout();
    const { dimensions, listener, placeDistanceM } = this.form.getRawValue();
    if (!layout || this.form.controls.dimensions.invalid || this.form.controls.listener.invalid) return;
    const names = new Map(this.speakers.controls.map((s) => [s.controls.id.value, s.controls.name.value]));
    const placed = placeLayoutLoudspeakers(layout.channels, listener, Number(placeDistanceM), dimensions);
    this.speakers.clear({ emitEvent: false });
    for (const speaker of placed) {
      this.speakers.push(
        this.speakerForm({
          id: speaker.id,
          name: names.get(speaker.id) ?? '',
          x: mm(speaker.x),
          y: mm(speaker.y),
          z: mm(speaker.z),
        }),
        { emitEvent: false },
      );
    }
    this.speakers.markAsDirty();
    this.form.updateValueAndValidity();
    const pulled = placed.filter((speaker) => speaker.pulledIn).map((speaker) => speaker.id);
    this.snackBar.open(
      `${placed.length} loudspeakers placed at the layout's nominal angles.` +
        (pulled.length ? ` ${pulled.join(', ')} moved nearer to stay inside the room.` : ''),
      undefined,
      { duration: 6000 },
    );
  }

  protected addSpeaker(): void {
    const { listener } = this.form.getRawValue();
    this.speakers.push(
      this.speakerForm({
        id: this.missingChannels()[0] ?? '',
        name: '',
        x: listener.x,
        y: mm(listener.y - 2),
        z: listener.z,
      }),
    );
  }

  /** A loudspeaker dragged or moved by keyboard on the plan: the same x and y the table edits. */
  protected moveSpeaker(move: PlanMove): void {
    const speaker = this.speakers.at(move.index);
    if (!speaker) return;
    speaker.patchValue({ x: move.x, y: move.y });
    speaker.controls.x.markAsDirty();
    speaker.controls.y.markAsDirty();
  }

  protected removeSpeaker(index: number): void {
    this.speakers.removeAt(index);
  }

  protected errorOf(control: AbstractControl | null): string {
    const errors = control?.errors ?? {};
    if (errors['server']) return String(errors['server']);
    if (errors['required']) return 'Required.';
    if (errors['min']) return `At least ${errors['min'].min}.`;
    if (errors['max']) return `At most ${errors['max'].max}.`;
    if (errors['maxlength']) return `At most ${errors['maxlength'].requiredLength} characters.`;
    return 'Check this value.';
  }

  protected save(): void {
    this.form.markAllAsTouched();
    if (this.form.invalid) {
      this.saveProblem.set('Some values need attention; they are marked.');
      return;
    }
    const body = this.body();
    const id = this.roomId();
    this.saving.set(true);
    const request = id ? this.rooms.update(id, body) : this.rooms.create(body);
    request.subscribe({
      next: (room) => {
        this.saving.set(false);
        this.form.markAsPristine();
        this.snackBar.open(id ? `“${room.name}” saved.` : `“${room.name}” created.`, undefined, {
          duration: 4000,
        });
        void this.router.navigate(['/rooms', room.id]);
      },
      error: (error: unknown) => {
        this.saving.set(false);
        const problem = toProblem(error);
        let placed = 0;
        for (const field of problem.fieldErrors) {
          const path = formPathOf(field.pointer);
          const control = path ? this.form.get(path) : null;
          // A field gets the message under it; a whole list or row is named in the alert instead.
          if (control instanceof FormControl) {
            control.setErrors({ ...(control.errors ?? {}), server: field.message });
            control.markAsTouched();
            placed++;
          }
        }
        this.saveProblem.set(
          placed && placed === problem.fieldErrors.length
            ? `${problem.title}: see the marked fields.`
            : errorMessage(error),
        );
      },
    });
  }

  private roomDraft(): (RoomCreate & { name: string }) | null {
    const value = this.form.getRawValue();
    const numbers = [
      ...Object.values(value.dimensions),
      ...Object.values(value.listener),
      ...value.loudspeakers.flatMap((s) => [s.x, s.y, s.z]),
    ];
    if (numbers.some((n) => n === null || !Number.isFinite(Number(n)))) return null;
    return this.body();
  }

  private body(): RoomCreate & { name: string } {
    const value = this.form.getRawValue();
    const limits = limitsOf(value.limits);
    return {
      name: value.name.trim(),
      layout: value.layout,
      dimensions: {
        widthM: Number(value.dimensions.widthM),
        lengthM: Number(value.dimensions.lengthM),
        heightM: Number(value.dimensions.heightM),
      },
      listener: { x: Number(value.listener.x), y: Number(value.listener.y), z: Number(value.listener.z) },
      loudspeakers: value.loudspeakers.map((speaker) => ({
        id: speaker.id.trim(),
        ...(speaker.name.trim() ? { name: speaker.name.trim() } : {}),
        x: Number(speaker.x),
        y: Number(speaker.y),
        z: Number(speaker.z),
      })),
      ...(limits ? { limits } : {}),
      sampleRateHz: Number(value.sampleRateHz),
      profileId: value.profileId,
      ...(value.notes.trim() ? { notes: value.notes } : {}),
    };
  }

  private speakerForm(speaker: { id: string; name: string; x: number; y: number; z: number }): SpeakerForm {
    return this.fb.group({
      id: [speaker.id, [Validators.required, Validators.maxLength(LABEL_MAX_LENGTH)]],
      name: [speaker.name, Validators.maxLength(LIMITS['RoomLoudspeaker.name'].maxLength)],
      x: [speaker.x, metres],
      y: [speaker.y, metres],
      z: [speaker.z, metres],
    });
  }

  private load(room: Room): void {
    this.speakers.clear({ emitEvent: false });
    for (const speaker of room.loudspeakers) {
      this.speakers.push(this.speakerForm({ ...speaker, name: speaker.name ?? '' }), { emitEvent: false });
    }
    const limits = room.limits ?? {};
    this.form.patchValue({
      name: room.name,
      layout: room.layout,
      dimensions: room.dimensions,
      listener: room.listener,
      limits: {
        delayMaxMs: limits.delayMaxMs ?? null,
        trimMinDb: limits.trimMinDb ?? null,
        trimMaxDb: limits.trimMaxDb ?? null,
        eqBandsPerChannel: limits.eqBandsPerChannel ?? null,
        eqMaxBoostDb: limits.eqMaxBoostDb ?? null,
        eqMaxCutDb: limits.eqMaxCutDb ?? null,
      },
      sampleRateHz: room.sampleRateHz,
      profileId: room.profileId ?? null,
      notes: room.notes ?? '',
    });
    this.form.markAsPristine();
  }
}
