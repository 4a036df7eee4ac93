import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { catchError, of } from 'rxjs';
import { errorMessage, toProblem } from '../../problem/http-problem';
import { RoomsService } from '../../rooms/rooms.service';
import { COMMON_SAMPLE_RATES_HZ } from '../../sample-rates';
import { downloadBlob, downloadName } from '../download';
import { exportSummary } from '../export-summary';
import type { Tuning } from '../tuning.model';
import { TuningsService } from '../tunings.service';

export interface ExportDialogData {
  tuning: Pick<Tuning, 'id' | 'name' | 'version' | 'sampleRateHz'>;
  /** The room's processor profile, the API's default for an export; null when the room has none. */
  roomProfileId: string | null;
}

/**
 * Export for a processor: the profile (the room's by default, any other of the caller's, or exact values)
 * and the sample rate, then a summary of what rounding to the profile's steps cost per channel, the
 * export's cautions, and the JSON or CSV download of exactly what was summarised.
 */
@Component({
  selector: 'iso-export-dialog',
  imports: [
    MatButtonModule,
    MatDialogModule,
    MatFormFieldModule,
    MatIconModule,
    MatProgressBarModule,
    MatSelectModule,
  ],
  template: `
    <h2 mat-dialog-title>Export “{{ data.tuning.name }}” v{{ data.tuning.version }}</h2>
    <mat-dialog-content>
      <div class="choices">
        <mat-form-field>
          <mat-label>Processor profile</mat-label>
          <mat-select
            [value]="profile()"
            (selectionChange)="chooseProfile($event.value)"
            data-testid="export-profile"
          >
            @for (p of profiles(); track p.id) {
              <mat-option [value]="p.id"
                >{{ p.name }}{{ p.id === data.roomProfileId ? ' (the room’s)' : '' }}</mat-option
              >
            }
            <mat-option value="none">Exact values (no profile)</mat-option>
          </mat-select>
          <mat-hint>Values are rounded to the profile’s steps</mat-hint>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Sample rate</mat-label>
          <mat-select
            [value]="rateHz()"
            (selectionChange)="rateHz.set($event.value)"
            data-testid="export-rate"
          >
            @for (rate of rates(); track rate) {
              <mat-option [value]="rate"
                >{{ rate / 1000 }} kHz{{
                  rate === data.tuning.sampleRateHz ? ' (the tuning’s)' : ''
                }}</mat-option
              >
            }
          </mat-select>
          <mat-hint>Coefficients are designed at this rate</mat-hint>
        </mat-form-field>
      </div>
      @if (preview.isLoading()) {
        <mat-progress-bar mode="indeterminate" aria-label="Preparing the export" />
      }
      @if (problem(); as p) {
        <div class="iso-alert" role="alert" data-testid="export-problem">
          <mat-icon aria-hidden="true">error</mat-icon>
          <div>
            <strong>{{ p.title }}</strong>
            @if (p.detail) {
              <div>{{ p.detail }}</div>
            }
            @for (e of fieldErrorsBeyondDetail(); track $index) {
              <div>{{ e }}</div>
            }
          </div>
        </div>
      }
      @if (summary(); as s) {
        @if (exported()?.stale; as stale) {
          <div class="iso-caution" role="note" data-testid="export-stale">
            <mat-icon aria-hidden="true">update</mat-icon>
            <span>The room changed after this tuning was made: {{ stale.reasons.join('; ') }}.</span>
          </div>
        }
        <p class="headline" [class.notable]="s.notableCount > 0" data-testid="export-rounding">
          {{ s.headline }}
        </p>
        <div class="iso-table-scroll">
          <table data-testid="export-channels">
            <caption class="iso-visually-hidden">
              What the export holds per channel and what rounding cost its EQ
            </caption>
            <thead>
              <tr>
                <th scope="col">Channel</th>
                <th scope="col" class="num">Delay</th>
                <th scope="col" class="num">Trim</th>
                <th scope="col" class="num">Bands</th>
                <th scope="col">EQ change from rounding</th>
              </tr>
            </thead>
            <tbody>
              @for (row of s.rows; track row.channel) {
                <tr [class.notable]="row.notable">
                  <th scope="row">
                    <code>{{ row.channel }}</code>
                  </th>
                  <td class="num">{{ row.delay }}</td>
                  <td class="num">{{ row.trim }}</td>
                  <td class="num">{{ row.bands }}</td>
                  <td>
                    @if (row.notable) {
                      <mat-icon class="flag" aria-hidden="true">warning</mat-icon>
                    }
                    {{ row.rounding }}
                    @if (row.notable) {
                      <span class="iso-visually-hidden">(more than 0.5 dB)</span>
                    }
                  </td>
                </tr>
              }
            </tbody>
          </table>
        </div>
        @if (exported()?.header?.cautions?.length) {
          <div class="iso-caution cautions" data-testid="export-cautions">
            <mat-icon aria-hidden="true">warning</mat-icon>
            <ul>
              @for (caution of exported()!.header.cautions; track $index) {
                <li>{{ caution.message }}</li>
              }
            </ul>
          </div>
        }
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Close</button>
      <button
        mat-stroked-button
        type="button"
        [disabled]="!summary()"
        (click)="download('csv')"
        data-testid="export-csv"
      >
        <mat-icon>download</mat-icon> CSV
      </button>
      <button
        mat-flat-button
        type="button"
        [disabled]="!summary()"
        (click)="download('json')"
        data-testid="export-json"
      >
        <mat-icon>download</mat-icon> JSON
      </button>
    </mat-dialog-actions>
  `,
  styles: `
    .choices {
      display: flex;
      flex-wrap: wrap;
      gap: 4px 16px;
      padding-top: 4px;
    }
    .choices mat-form-field {
      width: min(340px, 100%);
    }
    .headline {
      font: var(--mat-sys-body-large);
      margin: 12px 0 8px;
    }
    table {
      width: 100%;
      border-collapse: collapse;
      font: var(--mat-sys-body-medium);
    }
    th,
    td {
      padding: 4px 8px;
      text-align: left;
      white-space: nowrap;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    thead th {
      font: var(--mat-sys-label-large);
      color: var(--mat-sys-on-surface-variant);
    }
    th[scope='row'] {
      font-weight: normal;
    }
    .num {
      text-align: right;
      font-variant-numeric: tabular-nums;
    }
    tr.notable td:last-child {
      font-weight: 500;
    }
    .flag {
      font-size: 18px;
      width: 18px;
      height: 18px;
      vertical-align: -4px;
      color: var(--mat-sys-error);
    }
    .cautions {
      margin-top: 12px;
    }
    .cautions ul,
    .iso-alert div {
      margin: 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ExportDialog {
  protected readonly data = inject<ExportDialogData>(MAT_DIALOG_DATA);
  private readonly tunings = inject(TuningsService);
  private readonly rooms = inject(RoomsService);
  private readonly snackBar = inject(MatSnackBar);

  private readonly profilesResource = rxResource({
    stream: () => this.rooms.profiles().pipe(catchError(() => of([]))),
  });
  protected readonly profiles = computed(() =>
    this.profilesResource.hasValue() ? (this.profilesResource.value() ?? []) : [],
  );
  protected readonly profile = signal<string>(this.data.roomProfileId ?? 'none');
  protected readonly rateHz = signal<number>(this.data.tuning.sampleRateHz);

  /** The chosen profile's rates (and the tuning's own, so a mismatch is shown by the API, not hidden). */
  protected readonly rates = computed(() => {
    const chosen = this.profiles().find((p) => p.id === this.profile());
    // Exporting exact values (no profile) offers the common studio rates.
    const offered = chosen ? chosen.sampleRatesHz : COMMON_SAMPLE_RATES_HZ;
    return [...new Set([this.data.tuning.sampleRateHz, ...offered, this.rateHz()])].sort((a, b) => a - b);
  });

  protected chooseProfile(id: string): void {
    this.profile.set(id);
    const chosen = this.profiles().find((p) => p.id === id);
    // A profile that cannot run at the current rate starts at its nearest rate instead.
    if (chosen && !chosen.sampleRatesHz.includes(this.rateHz()) && chosen.sampleRatesHz.length) {
      const nearest = [...chosen.sampleRatesHz].sort(
        (a, b) => Math.abs(a - this.data.tuning.sampleRateHz) - Math.abs(b - this.data.tuning.sampleRateHz),
      )[0];
      this.rateHz.set(nearest);
    }
  }

  private readonly options = computed(() => ({
    profile: this.profile(),
    sampleRateHz: this.rateHz() === this.data.tuning.sampleRateHz ? undefined : this.rateHz(),
  }));

  protected readonly preview = rxResource({
    params: () => this.options(),
    stream: ({ params }) => this.tunings.exportPreview(this.data.tuning.id, this.data.tuning.version, params),
  });
  protected readonly exported = computed(() =>
    this.preview.hasValue() ? (this.preview.value() ?? null) : null,
  );
  protected readonly summary = computed(() => {
    const exported = this.exported();
    return exported && !this.preview.error() ? exportSummary(exported) : null;
  });
  protected readonly problem = computed(() => {
    const error = this.preview.error();
    return error ? toProblem(error) : null;
  });
  protected readonly fieldErrorsBeyondDetail = computed(() => {
    const problem = this.problem();
    if (!problem) return [];
    return problem.fieldErrors.filter((e) => e.message !== problem.detail).map((e) => e.message);
  });

  protected download(format: 'json' | 'csv'): void {
    const { tuning } = this.data;
    this.tunings.export(tuning.id, format, tuning.version, this.options()).subscribe({
      next: (blob) => downloadBlob(blob, downloadName(tuning.name, tuning.version, format)),
      error: (error: unknown) => this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 10000 }),
    });
  }
}
