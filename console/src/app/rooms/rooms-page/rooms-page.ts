import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { formatDate, formatQuantity } from '../../format/format';
import { errorMessage } from '../../problem/http-problem';
import { RoomsService } from '../rooms.service';

@Component({
  selector: 'iso-rooms-page',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink],
  templateUrl: './rooms-page.html',
  styleUrl: './rooms-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RoomsPage {
  private readonly roomsService = inject(RoomsService);
  private readonly roomsResource = rxResource({ stream: () => this.roomsService.rooms() });
  protected readonly rooms = computed(() =>
    this.roomsResource.hasValue() ? this.roomsResource.value() : [],
  );
  protected readonly loading = this.roomsResource.isLoading;
  protected readonly error = computed(() => {
    const error = this.roomsResource.error();
    return error ? errorMessage(error) : null;
  });
  protected readonly formatDate = formatDate;
  protected readonly formatQuantity = formatQuantity;

  protected reload(): void {
    this.roomsResource.reload();
  }
}
