import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  signal,
  viewChild,
} from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { of } from 'rxjs';
import { SessionService } from '../../auth/session.service';
import { formatCount, formatDateTime, formatPercent } from '../../format/format';
import { maskedKey } from '../../keys/key-format';
import { KeysService } from '../../keys/keys.service';
import { errorMessage } from '../../problem/http-problem';
import { ChartView } from '../../ui/chart/chart';
import { usageRouteChart, usageTimeChart } from '../usage-charts';
import { type RangePreset, presetRange, usageByRoute, usageOverTime, usageTotals } from '../usage-series';
import { UsageGrouping, UsageLimits, UsageQuery, UsageRow } from '../usage.model';
import { UsageService } from '../usage.service';

const DAY_MS = 86_400_000;

@Component({
  selector: 'iso-usage-page',
  imports: [
    ChartView,
    FormsModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatDatepickerModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
  ],
  templateUrl: './usage-page.html',
  styleUrl: './usage-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UsagePage {
  private readonly usage = inject(UsageService);
  private readonly session = inject(SessionService);
  private readonly keysService = inject(KeysService);
  private readonly snackBar = inject(MatSnackBar);
  private readonly sort = viewChild(MatSort);
  private readonly paginator = viewChild(MatPaginator);

  protected readonly preset = signal<RangePreset | 'custom'>('7d');
  protected readonly customStart = signal<Date | null>(null);
  protected readonly customEnd = signal<Date | null>(null);
  protected readonly keyId = signal<string>('');
  protected readonly route = signal<string>('');
  protected readonly downloading = signal(false);
  protected readonly seesEveryone = computed(() => this.session.can('usage:all'));

  /** Bumped by Reload so a preset range ends at the current hour again. */
  private readonly tick = signal(0);

  protected readonly range = computed(() => {
    const preset = this.preset();
    this.tick();
    if (preset !== 'custom') return presetRange(preset, new Date());
    const start = this.customStart();
    const end = this.customEnd();
    if (!start || !end) return null;
    const from = new Date(start.getFullYear(), start.getMonth(), start.getDate());
    const to = new Date(new Date(end.getFullYear(), end.getMonth(), end.getDate()).getTime() + DAY_MS);
    const grouping: UsageGrouping = to.getTime() - from.getTime() <= 3 * DAY_MS ? 'hour' : 'day';
    return { from, to, grouping };
  });

  protected readonly query = computed<UsageQuery | null>(() => {
    const range = this.range();
    if (!range) return null;
    return {
      from: range.from.toISOString(),
      to: range.to.toISOString(),
      groupBy: range.grouping,
      keyId: this.keyId() || undefined,
      route: this.route() || undefined,
    };
  });

  private readonly rowsResource = rxResource({
    params: () => this.query() ?? undefined,
    stream: ({ params }) => this.usage.report(params),
  });
  /** Key names for the filter and the table; people who cannot list keys see prefixes from usage alone. */
  private readonly keysResource = rxResource({
    params: () => this.session.can('keys:view'),
    stream: ({ params }) => (params ? this.keysService.listAll() : of([])),
  });

  protected readonly rows = computed<UsageRow[]>(() =>
    this.rowsResource.hasValue() ? this.rowsResource.value().data : [],
  );
  /** The rate limits and key cap in force; kept from the last answer while a new one loads. */
  protected readonly limits = computed<UsageLimits | null>(() =>
    this.rowsResource.hasValue() ? (this.rowsResource.value().limits ?? null) : null,
  );
  protected readonly loading = this.rowsResource.isLoading;
  protected readonly error = computed(() => {
    const error = this.rowsResource.error();
    return error ? errorMessage(error) : null;
  });
  protected readonly totals = computed(() => usageTotals(this.rows()));
  protected readonly routes = computed(() => usageByRoute(this.rows()));
  protected readonly timeChart = computed(() => {
    const range = this.range();
    if (!range) return null;
    return usageTimeChart(usageOverTime(this.rows(), range.from, range.to, range.grouping), range.grouping);
  });
  protected readonly routeChart = computed(() => usageRouteChart(this.routes()));

  private readonly knownRoutes = signal<string[]>([]);
  protected readonly routeOptions = computed(() => this.knownRoutes());
  protected readonly keyOptions = computed(() => {
    const keys = this.keysResource.hasValue() ? this.keysResource.value() : [];
    const options = new Map(keys.map((key) => [key.id, `${key.name} (${maskedKey(key)})`]));
    for (const row of this.rows()) {
      if (row.keyId && !options.has(row.keyId)) options.set(row.keyId, row.keyName ?? row.keyId);
    }
    return [...options.entries()]
      .map(([id, label]) => ({ id, label }))
      .sort((a, b) => a.label.localeCompare(b.label));
  });

  protected readonly columns = ['bucket', 'key', 'route', 'count', 'errorCount'];
  protected readonly dataSource = new MatTableDataSource<UsageRow>([]);
  protected readonly formatCount = formatCount;
  protected readonly formatPercent = formatPercent;
  protected readonly formatDateTime = formatDateTime;

  constructor() {
    this.dataSource.sortingDataAccessor = (row, column) => {
      if (column === 'bucket') return new Date(row.bucket).getTime();
      if (column === 'key') return this.keyName(row.keyId);
      const value = row[column as keyof UsageRow];
      return typeof value === 'number' ? value : String(value ?? '');
    };
    effect(() => {
      this.dataSource.data = this.rows();
      this.paginator()?.firstPage();
    });
    effect(() => {
      const sort = this.sort();
      const paginator = this.paginator();
      if (sort) this.dataSource.sort = sort;
      if (paginator) this.dataSource.paginator = paginator;
    });
    effect(() => {
      // Routes seen so far stay selectable even after a route filter narrows the rows.
      const seen = new Set(this.knownRoutes());
      let grew = false;
      for (const row of this.rows()) {
        if (!seen.has(row.route)) {
          seen.add(row.route);
          grew = true;
        }
      }
      if (grew) this.knownRoutes.set([...seen].sort());
    });
  }

  protected heldKeys(limits: UsageLimits): string {
    if (limits.activeKeys === null) return '';
    const who = this.seesEveryone() ? 'This user holds' : 'You hold';
    return `${who} ${formatCount(limits.activeKeys)} active key${limits.activeKeys === 1 ? '' : 's'}.`;
  }

  protected keyName(keyId: string | null): string {
    if (!keyId) return 'Console session';
    return this.keyOptions().find((option) => option.id === keyId)?.label ?? keyId;
  }

  protected reload(): void {
    this.tick.update((value) => value + 1);
  }

  protected download(): void {
    const query = this.query();
    if (!query) return;
    this.downloading.set(true);
    this.usage.csv(query).subscribe({
      next: (blob) => {
        this.downloading.set(false);
        const url = URL.createObjectURL(blob);
        const link = document.createElement('a');
        link.href = url;
        link.download = `isochron-usage-${query.from.slice(0, 10)}-to-${query.to.slice(0, 10)}.csv`;
        link.click();
        setTimeout(() => URL.revokeObjectURL(url), 1000);
      },
      error: (error: unknown) => {
        this.downloading.set(false);
        this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 10000 });
      },
    });
  }
}
