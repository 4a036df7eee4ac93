import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { formatQuantity } from '../../format/format';
import type { ImpulseResponseAnalysis } from '../../rooms/room-measurements/measurement.model';

/**
 * The parts of an impulse-response (or deconvolved sweep) analysis this list shows; with a loopback channel,
 * `timing` counts the arrival from the loopback's.
 */
export type ImpulseResponseFactsSource = Pick<
  ImpulseResponseAnalysis,
  'arrival' | 'level' | 'decay' | 'room' | 'timing'
>;

/**
 * The facts of one impulse response at a glance: arrival (and, with a loopback, the arrival after it),
 * peak, peak to noise, EDT, T20, T30 and, when the room's dimensions were known, the Schroeder frequency.
 * Used wherever an impulse-response analysis is shown (a room's measurements, a capture take).
 */
@Component({
  selector: 'iso-ir-facts',
  template: `
    @let ir = analysis();
    <dl class="facts">
      <div>
        <dt>Arrival</dt>
        <dd>{{ format(ir.arrival.arrivalMs, 'ms', 2) }}</dd>
      </div>
      @if (ir.timing; as timing) {
        <div>
          <dt>After the loopback</dt>
          <dd data-testid="from-reference">{{ format(timing.arrivalFromReferenceMs, 'ms', 2) }}</dd>
        </div>
      }
      <div>
        <dt>Peak</dt>
        <dd>{{ format(ir.level.peakDbfs, 'dBFS', 1) }}</dd>
      </div>
      <div>
        <dt>Peak to noise</dt>
        <dd>{{ format(ir.level.peakToNoiseDb, 'dB', 1) }}</dd>
      </div>
      <div>
        <dt>EDT</dt>
        <dd>{{ format(ir.decay.edtS, 's', 2) }}</dd>
      </div>
      <div>
        <dt>T20</dt>
        <dd>{{ format(ir.decay.t20S, 's', 2) }}</dd>
      </div>
      <div>
        <dt>T30</dt>
        <dd>{{ format(ir.decay.t30S, 's', 2) }}</dd>
      </div>
      @if (ir.room; as room) {
        <div>
          <dt>Schroeder frequency</dt>
          <dd data-testid="schroeder">{{ format(room.schroederFrequencyHz, 'Hz', 0) }}</dd>
        </div>
      }
    </dl>
  `,
  styles: `
    :host {
      display: block;
    }
    .facts {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(130px, 1fr));
      gap: 8px 16px;
      margin: 0 0 12px;
    }
    dt {
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-label-medium);
    }
    dd {
      margin: 0;
      font: var(--mat-sys-title-medium);
      font-variant-numeric: tabular-nums;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ImpulseResponseFacts {
  readonly analysis = input.required<ImpulseResponseFactsSource>();
  protected readonly format = formatQuantity;
}
