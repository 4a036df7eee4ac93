import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatTableModule } from '@angular/material/table';
import { formatQuantity, formatSigned } from '../../format/format';
import type { TuningComparison } from '../tuning.model';

/** The API's channel-by-channel comparison of two tunings or versions, right minus left. */
@Component({
  selector: 'iso-comparison-view',
  imports: [MatTableModule],
  template: `
    @let result = comparison();
    @if (result.identical) {
      <p class="iso-notice" role="status">
        “{{ result.left.name }}” v{{ result.left.version }} and “{{ result.right.name }}” v{{
          result.right.version
        }}
        have the same settings.
      </p>
    } @else {
      <p class="iso-notice" role="status">
        Differences from “{{ result.left.name }}” (v{{ result.left.version }}) to “{{ result.right.name }}”
        (v{{ result.right.version }}). LFE gain {{ formatSigned(result.subwoofer.lfeGainDbDifference, 'dB')
        }}{{ result.subwoofer.lowPassChanged ? ', subwoofer low-pass changed' : '' }}.
      </p>
      <div class="iso-table-scroll">
        <table mat-table [dataSource]="result.channels" data-testid="comparison">
          <caption class="iso-visually-hidden">
            Per-channel differences, right minus left
          </caption>
          <ng-container matColumnDef="id">
            <th mat-header-cell *matHeaderCellDef>Channel</th>
            <td mat-cell *matCellDef="let row">
              <code>{{ row.id }}</code>
              @if (row.presentIn !== 'both') {
                <span class="iso-chip is-warn">only {{ row.presentIn }}</span>
              }
            </td>
          </ng-container>
          <ng-container matColumnDef="delay">
            <th mat-header-cell *matHeaderCellDef class="num">Delay</th>
            <td mat-cell *matCellDef="let row" class="num">
              {{ formatSigned(row.delayMsDifference, 'ms', 3) }}
            </td>
          </ng-container>
          <ng-container matColumnDef="trim">
            <th mat-header-cell *matHeaderCellDef class="num">Trim</th>
            <td mat-cell *matCellDef="let row" class="num">
              {{ formatSigned(row.trimDbDifference, 'dB', 1) }}
            </td>
          </ng-container>
          <ng-container matColumnDef="polarity">
            <th mat-header-cell *matHeaderCellDef>Polarity</th>
            <td mat-cell *matCellDef="let row">{{ row.polarityChanged ? 'changed' : '—' }}</td>
          </ng-container>
          <ng-container matColumnDef="highPass">
            <th mat-header-cell *matHeaderCellDef>High-pass / bass managed</th>
            <td mat-cell *matCellDef="let row">
              {{ row.highPassChanged ? 'high-pass changed' : '—'
              }}{{ row.bassManagedChanged ? ', bass management changed' : '' }}
            </td>
          </ng-container>
          <ng-container matColumnDef="eq">
            <th mat-header-cell *matHeaderCellDef>EQ bands</th>
            <td mat-cell *matCellDef="let row">
              {{ row.eqBands.left }} → {{ row.eqBands.right }}{{ row.eqChanged ? ' (changed)' : '' }}
            </td>
          </ng-container>
          <ng-container matColumnDef="response">
            <th mat-header-cell *matHeaderCellDef class="num">Largest response difference</th>
            <td mat-cell *matCellDef="let row" class="num">
              {{ formatQuantity(row.maxResponseDifferenceDb, 'dB', 1) }}
            </td>
          </ng-container>
          <tr mat-header-row *matHeaderRowDef="columns"></tr>
          <tr mat-row *matRowDef="let row; columns: columns"></tr>
        </table>
      </div>
    }
  `,
  styles: `
    table {
      width: 100%;
    }
    td,
    th {
      white-space: nowrap;
    }
    .num {
      text-align: right;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ComparisonView {
  readonly comparison = input.required<TuningComparison>();
  protected readonly columns = ['id', 'delay', 'trim', 'polarity', 'highPass', 'eq', 'response'];
  protected readonly formatSigned = formatSigned;
  protected readonly formatQuantity = formatQuantity;
}
