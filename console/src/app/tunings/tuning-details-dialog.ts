import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import {
  AbstractControl,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  ValidationErrors,
  Validators,
} from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { LIMITS, NAME_MAX_LENGTH } from '../../../../shared/limits';

/** A name must have something besides spaces: the API trims nothing and would store "   ". */
export function notBlank(control: AbstractControl<string>): ValidationErrors | null {
  return control.value.trim() ? null : { required: true };
}

export interface TuningDetails {
  name: string;
  notes: string | null;
}

/** Renames a tuning and edits its notes; closes with the new details, or nothing on cancel. */
@Component({
  selector: 'iso-tuning-details-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  template: `
    <h2 mat-dialog-title>Name and notes</h2>
    <form [formGroup]="form" (ngSubmit)="confirm()" novalidate>
      <mat-dialog-content>
        <p class="lead">Saving makes a new version with the same settings.</p>
        <mat-form-field class="full">
          <mat-label>Name</mat-label>
          <input matInput formControlName="name" [maxlength]="maxName" required data-testid="tuning-name" />
          @if (form.controls.name.invalid) {
            <mat-error>Give the tuning a name.</mat-error>
          }
        </mat-form-field>
        <mat-form-field class="full">
          <mat-label>Notes</mat-label>
          <textarea
            matInput
            formControlName="notes"
            rows="5"
            [maxlength]="maxNotes"
            data-testid="tuning-notes"
          ></textarea>
          <mat-hint align="end">{{ form.controls.notes.value.length }} / {{ maxNotes }}</mat-hint>
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" data-testid="save-details">Save</button>
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
export class TuningDetailsDialog {
  private readonly data = inject<TuningDetails>(MAT_DIALOG_DATA);
  private readonly dialogRef = inject<MatDialogRef<TuningDetailsDialog, TuningDetails>>(MatDialogRef);
  protected readonly maxName = NAME_MAX_LENGTH;
  protected readonly maxNotes = LIMITS['TuningUpdate.notes'].maxLength;
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [this.data.name, [Validators.required, notBlank, Validators.maxLength(NAME_MAX_LENGTH)]],
    notes: [this.data.notes ?? '', Validators.maxLength(LIMITS['TuningUpdate.notes'].maxLength)],
  });

  protected confirm(): void {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const { name, notes } = this.form.getRawValue();
    this.dialogRef.close({ name: name.trim(), notes: notes.trim() ? notes : null });
  }
}
