import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import type { Tuning } from '../../tunings/tuning.model';

export interface ApplyFitData {
  tunings: Tuning[];
  /** The measured channel: offered first. */
  channel: string;
  bandCount: number;
}

export interface ApplyFitChoice {
  tuningId: string;
  channel: string;
}

/** Picks the tuning and the channel a fitted EQ goes into; closes with the choice, or nothing. */
@Component({
  selector: 'iso-apply-fit-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatSelectModule],
  template: `
    <h2 mat-dialog-title>Apply the fitted EQ</h2>
    <mat-dialog-content>
      <p class="lead">
        The {{ data.bandCount }} fitted band{{ data.bandCount === 1 ? '' : 's' }} replace the EQ of the chosen
        channel; the tuning gets a new version and the old one stays restorable.
      </p>
      <mat-form-field class="full">
        <mat-label>Tuning</mat-label>
        <mat-select
          [value]="tuningId()"
          (selectionChange)="pickTuning($event.value)"
          data-testid="apply-tuning"
        >
          @for (tuning of data.tunings; track tuning.id) {
            <mat-option [value]="tuning.id">{{ tuning.name }} (v{{ tuning.latestVersion }})</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <mat-form-field class="full">
        <mat-label>Channel</mat-label>
        <mat-select
          [value]="channel()"
          (selectionChange)="channel.set($event.value)"
          data-testid="apply-channel"
        >
          @for (id of channels(); track id) {
            <mat-option [value]="id">{{ id }}{{ id === data.channel ? ' (measured)' : '' }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Cancel</button>
      <button
        mat-flat-button
        type="button"
        (click)="apply()"
        [disabled]="!channel()"
        data-testid="apply-confirm"
      >
        Apply to {{ channel() || 'channel' }}
      </button>
    </mat-dialog-actions>
  `,
  styles: `
    .lead {
      margin: 0 0 12px;
      max-width: 52ch;
      color: var(--mat-sys-on-surface-variant);
    }
    .full {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ApplyFitDialog {
  protected readonly data = inject<ApplyFitData>(MAT_DIALOG_DATA);
  private readonly dialogRef = inject<MatDialogRef<ApplyFitDialog, ApplyFitChoice>>(MatDialogRef);
  protected readonly tuningId = signal(this.data.tunings.at(-1)?.id ?? '');
  protected readonly channels = computed(
    () => this.data.tunings.find((t) => t.id === this.tuningId())?.channels.map((c) => c.id) ?? [],
  );
  protected readonly channel = signal(this.data.channel);

  protected pickTuning(id: string): void {
    this.tuningId.set(id);
    if (!this.channels().includes(this.channel())) this.channel.set(this.channels()[0] ?? '');
  }

  protected apply(): void {
    if (this.tuningId() && this.channel())
      this.dialogRef.close({ tuningId: this.tuningId(), channel: this.channel() });
  }
}
