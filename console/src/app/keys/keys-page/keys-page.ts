import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  computed,
  effect,
  inject,
  signal,
  viewChild,
} from '@angular/core';
import { rxResource, takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { catchError, filter, of } from 'rxjs';
import { UsersService } from '../../users/users.service';
import { roleLabel } from '../../auth/roles';
import { SessionService } from '../../auth/session.service';
import { formatDate, formatDateTime, formatRelative } from '../../format/format';
import { errorMessage } from '../../problem/http-problem';
import { ConfirmDialog, ConfirmDialogData } from '../../ui/confirm-dialog/confirm-dialog';
import { KeyCreateDialog } from '../key-create-dialog/key-create-dialog';
import { KeyEditDialog } from '../key-edit-dialog/key-edit-dialog';
import { keyMatchesFilter, keySortValue, keyStatus, maskedKey, rateLimitLabel } from '../key-format';
import { ApiKey } from '../key.model';
import { KeysService } from '../keys.service';

@Component({
  selector: 'iso-keys-page',
  imports: [
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSlideToggleModule,
    MatSortModule,
    MatTableModule,
    MatTooltipModule,
  ],
  templateUrl: './keys-page.html',
  styleUrl: './keys-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class KeysPage {
  private readonly keysService = inject(KeysService);
  private readonly usersService = inject(UsersService);
  private readonly session = inject(SessionService);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly destroyRef = inject(DestroyRef);
  private readonly sort = viewChild(MatSort);
  private readonly paginator = viewChild(MatPaginator);

  protected readonly keys = signal<ApiKey[]>([]);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly filterText = signal('');
  protected readonly showRevoked = signal(false);
  protected readonly now = signal(new Date());
  protected readonly canManage = computed(() => this.session.can('keys:manage'));
  protected readonly showOwner = computed(() => this.session.can('keys:all'));
  protected readonly columns = computed(() => [
    'name',
    'role',
    'key',
    'created',
    'lastUsed',
    'expires',
    'rateLimit',
    'status',
    ...(this.canManage() ? ['actions'] : []),
  ]);
  protected readonly activeCount = computed(
    () => this.keys().filter((key) => keyStatus(key, this.now()) === 'active').length,
  );

  /** Admins see other people's keys; their e-mail reads better than a user id. */
  private readonly owners = rxResource({
    params: () => this.showOwner(),
    stream: ({ params }) => (params ? this.usersService.listAll().pipe(catchError(() => of([]))) : of([])),
  });
  protected readonly ownerEmail = computed(() => {
    const users = this.owners.hasValue() ? this.owners.value() : [];
    return new Map(users.map((user) => [user.id, user.email]));
  });

  protected readonly dataSource = new MatTableDataSource<ApiKey>([]);
  protected readonly roleLabel = roleLabel;
  protected readonly maskedKey = maskedKey;
  protected readonly formatDate = formatDate;
  protected readonly formatDateTime = formatDateTime;
  protected readonly formatRelative = formatRelative;
  protected readonly rateLimitLabel = rateLimitLabel;
  protected readonly keyStatus = keyStatus;

  constructor() {
    this.dataSource.filterPredicate = (key, text) =>
      keyMatchesFilter({ ...key, ownerEmail: this.ownerEmail().get(key.ownerId ?? '') }, text, this.now());
    this.dataSource.sortingDataAccessor = (key, column) => keySortValue(key, column, this.now());
    effect(() => {
      this.dataSource.data = this.keys();
    });
    effect(() => {
      this.dataSource.filter = this.filterText();
      this.paginator()?.firstPage();
    });
    effect(() => {
      const sort = this.sort();
      const paginator = this.paginator();
      if (sort) this.dataSource.sort = sort;
      if (paginator) this.dataSource.paginator = paginator;
    });
    this.reload();
  }

  protected reload(): void {
    this.loading.set(true);
    this.error.set(null);
    this.keysService
      .listAll(this.showRevoked())
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (keys) => {
          this.now.set(new Date());
          this.keys.set(keys);
          this.loading.set(false);
        },
        error: (error: unknown) => {
          this.loading.set(false);
          this.error.set(errorMessage(error));
        },
      });
  }

  protected toggleRevoked(show: boolean): void {
    this.showRevoked.set(show);
    this.reload();
  }

  protected openCreate(): void {
    this.dialog
      .open(KeyCreateDialog, { width: '560px', maxWidth: '94vw', autoFocus: 'first-tabbable' })
      .afterClosed()
      .pipe(filter((key) => key !== undefined))
      .subscribe((key) => {
        // The dialog hands back the key without its secret; the list never holds one.
        const { secret: _secret, ...listed } = key;
        this.keys.update((keys) => [listed, ...keys.filter((existing) => existing.id !== listed.id)]);
        this.snackBar.open(`Key “${listed.name}” created.`, undefined, { duration: 4000 });
      });
  }

  protected openEdit(key: ApiKey): void {
    this.dialog
      .open(KeyEditDialog, { data: key, width: '460px', maxWidth: '94vw' })
      .afterClosed()
      .pipe(filter((updated): updated is ApiKey => Boolean(updated)))
      .subscribe((updated) => {
        this.keys.update((keys) =>
          keys.map((existing) => (existing.id === updated.id ? { ...existing, ...updated } : existing)),
        );
        this.snackBar.open(`Key “${updated.name}” saved.`, undefined, { duration: 4000 });
      });
  }

  protected confirmRevoke(key: ApiKey): void {
    const data: ConfirmDialogData = {
      title: `Revoke “${key.name}”?`,
      message: `Every request with ${maskedKey(key)} will be refused from the next call on. This cannot be undone; a new key has a new secret.`,
      confirmLabel: 'Revoke key',
      destructive: true,
    };
    this.dialog
      .open(ConfirmDialog, { data, maxWidth: '94vw' })
      .afterClosed()
      .pipe(filter((confirmed) => confirmed === true))
      .subscribe(() => this.revoke(key));
  }

  private revoke(key: ApiKey): void {
    this.keysService.revoke(key.id).subscribe({
      next: (revoked) => {
        const revokedAt = revoked?.revokedAt ?? new Date().toISOString();
        this.keys.update((keys) =>
          keys.map((existing) =>
            existing.id === key.id ? { ...existing, ...revoked, revokedAt } : existing,
          ),
        );
        this.snackBar.open(`Key “${key.name}” revoked.`, undefined, { duration: 4000 });
      },
      error: (error: unknown) => this.snackBar.open(errorMessage(error), 'Dismiss', { duration: 10000 }),
    });
  }
}
