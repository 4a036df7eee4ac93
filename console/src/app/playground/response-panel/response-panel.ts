import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { problemSummary, readProblem } from '../../problem/problem-message';
import { ChartView } from '../../ui/chart/chart';
import { PlaygroundResponse } from '../playground.service';
import { curvesFromResult, magnitudeChart, phaseChart } from '../response-plot';

/** Status, headers, body and — for filter results — the frequency response of what came back. */
@Component({
  selector: 'iso-response-panel',
  imports: [ChartView, MatExpansionModule, MatIconModule, MatSlideToggleModule],
  templateUrl: './response-panel.html',
  styleUrl: './response-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResponsePanel {
  readonly response = input.required<PlaygroundResponse>();
  /** The body that was sent; its sample rate is used when the answer carries only sections. */
  readonly requestBody = input<unknown>();

  protected readonly showPhase = signal(false);
  protected readonly tone = computed(() => {
    const status = this.response().status;
    if (status >= 200 && status < 300) return 'is-ok';
    if (status >= 400 && status < 500) return 'is-warn';
    return 'is-bad';
  });
  protected readonly problem = computed(() => {
    const response = this.response();
    if (response.status >= 200 && response.status < 400) return null;
    return problemSummary(readProblem(response.status, response.body ?? response.bodyText));
  });
  protected readonly pretty = computed(() => {
    const response = this.response();
    return response.body !== undefined ? JSON.stringify(response.body, null, 2) : response.bodyText;
  });
  protected readonly curves = computed(() => {
    const response = this.response();
    return response.status < 300 ? curvesFromResult(response.body, this.requestBody()) : [];
  });
  protected readonly computed = computed(() => this.curves().some((curve) => curve.source === 'computed'));
  protected readonly magnitude = computed(() =>
    this.curves().length ? magnitudeChart(this.curves()) : null,
  );
  protected readonly phase = computed(() => (this.curves().length ? phaseChart(this.curves()) : null));
  protected readonly warnings = computed(() => this.notices('warnings'));
  protected readonly cautions = computed(() => this.notices('cautions'));

  private notices(field: 'warnings' | 'cautions'): string[] {
    const body = this.response().body;
    if (typeof body !== 'object' || body === null) return [];
    const list = (body as Record<string, unknown>)[field];
    if (!Array.isArray(list)) return [];
    return list.flatMap((item) => {
      if (typeof item !== 'object' || item === null) return [];
      const { message, channel } = item as { message?: unknown; channel?: unknown };
      if (typeof message !== 'string') return [];
      return [typeof channel === 'string' ? `${channel}: ${message}` : message];
    });
  }
}
