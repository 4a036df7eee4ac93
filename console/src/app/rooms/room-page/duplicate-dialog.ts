import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { notBlank } from '../../tunings/tuning-details-dialog';
import { NAME_MAX_LENGTH } from '../../../../../shared/limits';

export interface NameDialogData {
  title: string;
  /** The name offered. */
  name: string;
  lead?: string;
  /** The button's label (default "Duplicate"). */
  action?: string;
}

/** Asks for the name of the copy; closes with the name, or nothing on cancel. */
@Component({
  selector: 'iso-duplicate-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  template: `
    <h2 mat-dialog-title>{{ data.title }}</h2>
    <form [formGroup]="form" (ngSubmit)="confirm()" novalidate>
      <mat-dialog-content>
        <p class="lead">
          {{
            data.lead ?? 'The copy starts at version 1 with the same settings; the original stays as it is.'
          }}
        </p>
        <mat-form-field class="full">
          <mat-label>{{ data.action ? 'Name' : 'Name of the copy' }}</mat-label>
          <input
            matInput
            formControlName="name"
            [maxlength]="maxName"
            required
            data-testid="duplicate-name"
          />
          @if (form.controls.name.invalid) {
            <mat-error>Give it a name.</mat-error>
          }
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" data-testid="confirm-duplicate">
          {{ data.action ?? 'Duplicate' }}
        </button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .lead {
      margin: 0 0 12px;
      color: var(--mat-sys-on-surface-variant);
    }
    .full {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DuplicateDialog {
  protected readonly data = inject<NameDialogData>(MAT_DIALOG_DATA);
  private readonly dialogRef = inject<MatDialogRef<DuplicateDialog, string>>(MatDialogRef);
  protected readonly maxName = NAME_MAX_LENGTH;
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [
      this.data.name.slice(0, NAME_MAX_LENGTH),
      [Validators.required, notBlank, Validators.maxLength(NAME_MAX_LENGTH)],
    ],
  });

  protected confirm(): void {
    // A name of spaces only stays in the dialog with its message instead of closing on nothing.
    this.form.markAllAsTouched();
    if (this.form.valid) this.dialogRef.close(this.form.getRawValue().name.trim());
  }
}
