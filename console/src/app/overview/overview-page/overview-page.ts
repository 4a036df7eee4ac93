import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { of } from 'rxjs';
import { roleLabel } from '../../auth/roles';
import { SessionService } from '../../auth/session.service';
import { formatCount, formatPercent } from '../../format/format';
import { keyStatus } from '../../keys/key-format';
import { KeysService } from '../../keys/keys.service';
import { errorMessage } from '../../problem/http-problem';
import { ChartView } from '../../ui/chart/chart';
import { usageTimeChart } from '../../usage/usage-charts';
import { presetRange, rowsSince, usageByRoute, usageOverTime, usageTotals } from '../../usage/usage-series';
import { UsageService } from '../../usage/usage.service';

@Component({
  selector: 'iso-overview-page',
  imports: [ChartView, MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink],
  templateUrl: './overview-page.html',
  styleUrl: './overview-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OverviewPage {
  private readonly session = inject(SessionService);
  private readonly usage = inject(UsageService);
  private readonly keysService = inject(KeysService);

  protected readonly user = this.session.user;
  protected readonly roleLabel = computed(() => roleLabel(this.session.role() ?? ''));
  protected readonly canManageKeys = computed(() => this.session.can('keys:manage'));
  protected readonly canManageUsers = computed(() => this.session.can('users:manage'));
  private readonly week = presetRange('7d', new Date());

  private readonly usageResource = rxResource({
    stream: () =>
      this.usage.rows({
        from: this.week.from.toISOString(),
        to: this.week.to.toISOString(),
        groupBy: 'hour',
      }),
  });
  private readonly keysResource = rxResource({
    params: () => this.session.can('keys:view'),
    stream: ({ params }) => (params ? this.keysService.listAll() : of(null)),
  });

  protected readonly loading = this.usageResource.isLoading;
  protected readonly error = computed(() => {
    const error = this.usageResource.error();
    return error ? errorMessage(error) : null;
  });
  private readonly rows = computed(() => (this.usageResource.hasValue() ? this.usageResource.value() : []));
  protected readonly week7 = computed(() => usageTotals(this.rows()));
  protected readonly today = computed(() => {
    const now = new Date();
    return usageTotals(rowsSince(this.rows(), new Date(now.getFullYear(), now.getMonth(), now.getDate())));
  });
  protected readonly topRoutes = computed(() => usageByRoute(this.rows()).slice(0, 5));
  protected readonly chart = computed(() =>
    usageTimeChart(usageOverTime(this.rows(), this.week.from, this.week.to, 'day'), 'day'),
  );
  protected readonly activeKeys = computed(() => {
    const keys = this.keysResource.hasValue() ? this.keysResource.value() : null;
    if (!keys) return null;
    const now = new Date();
    return keys.filter((key) => keyStatus(key, now) === 'active').length;
  });

  protected readonly formatCount = formatCount;
  protected readonly formatPercent = formatPercent;
}
