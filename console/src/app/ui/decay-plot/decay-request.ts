import { ChangeDetectionStrategy, Component, computed, input, model } from '@angular/core';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { DECAY_LIMITS, DEFAULT_DECAY_REQUEST, type DecayRequest, decayRequestProblems } from './decay-scale';

/**
 * Asks for decay plots with an analysis: waterfall and/or spectrogram, and how many time slices and
 * frequencies (within the contract's limits, checked here before anything is sent).
 */
@Component({
  selector: 'iso-decay-request',
  imports: [MatCheckboxModule, MatFormFieldModule, MatInputModule],
  template: `
    <fieldset class="decay-request" data-testid="decay-request">
      <legend>Decay over frequency</legend>
      <div class="choices">
        <mat-checkbox
          [checked]="value().waterfall"
          (change)="change({ waterfall: $event.checked })"
          data-testid="decay-waterfall"
          >Waterfall</mat-checkbox
        >
        <mat-checkbox
          [checked]="value().spectrogram"
          (change)="change({ spectrogram: $event.checked })"
          data-testid="decay-spectrogram"
          >Spectrogram</mat-checkbox
        >
      </div>
      @if (asked()) {
        <div class="fields">
          <mat-form-field subscriptSizing="dynamic">
            <mat-label>Time slices</mat-label>
            <input
              matInput
              type="number"
              [min]="limits.slices.minimum"
              [max]="limits.slices.maximum"
              step="1"
              [value]="value().slices"
              (input)="change({ slices: numberFrom($event) })"
              data-testid="decay-slices-count"
            />
            @if (problems().slices; as message) {
              <mat-hint class="field-problem">{{ message }}</mat-hint>
            } @else {
              <mat-hint>{{ limits.slices.minimum }}–{{ limits.slices.maximum }}, over 300 ms</mat-hint>
            }
          </mat-form-field>
          <mat-form-field subscriptSizing="dynamic">
            <mat-label>Frequencies</mat-label>
            <input
              matInput
              type="number"
              [min]="limits.bins.minimum"
              [max]="limits.bins.maximum"
              step="1"
              [value]="value().bins"
              (input)="change({ bins: numberFrom($event) })"
              data-testid="decay-bins-count"
            />
            @if (problems().bins; as message) {
              <mat-hint class="field-problem">{{ message }}</mat-hint>
            } @else {
              <mat-hint>{{ limits.bins.minimum }}–{{ limits.bins.maximum }}, 20 Hz to 20 kHz</mat-hint>
            }
          </mat-form-field>
        </div>
      }
      @if (note()) {
        <p class="hint">{{ note() }}</p>
      }
    </fieldset>
  `,
  styles: `
    .decay-request {
      border: 0;
      margin: 0;
      padding: 0;
      min-width: 0;
    }
    legend {
      font: var(--mat-sys-title-small);
      padding: 0;
      margin-bottom: 4px;
    }
    .choices {
      display: flex;
      flex-wrap: wrap;
      gap: 0 16px;
      margin-left: -8px;
    }
    .fields {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(180px, 1fr));
      gap: 8px 16px;
      margin-top: 4px;
    }
    mat-form-field {
      width: 100%;
    }
    .field-problem {
      color: var(--mat-sys-error);
    }
    .hint {
      margin: 6px 0 0;
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DecayRequestControl {
  readonly value = model<DecayRequest>({ ...DEFAULT_DECAY_REQUEST });
  /** A line under the choices, e.g. that the audio is not kept. */
  readonly note = input('');

  protected readonly limits = DECAY_LIMITS;
  protected readonly asked = computed(() => this.value().waterfall || this.value().spectrogram);
  protected readonly problems = computed(() => decayRequestProblems(this.value()));

  protected change(change: Partial<DecayRequest>): void {
    this.value.update((value) => ({ ...value, ...change }));
  }

  protected numberFrom(event: Event): number {
    return Number((event.target as HTMLInputElement).value);
  }
}
