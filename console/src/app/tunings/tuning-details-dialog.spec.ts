import { FormControl } from '@angular/forms';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { NAME_MAX_LENGTH } from '../../../../shared/limits';
import { openDialog } from '../../testing/dialogs';
import { TuningDetails, TuningDetailsDialog, notBlank } from './tuning-details-dialog';

async function open(data: TuningDetails) {
  const opened = await openDialog<TuningDetailsDialog, TuningDetails>(TuningDetailsDialog, { data });
  const name = await opened.loader.getHarness(
    MatInputHarness.with({ selector: '[data-testid="tuning-name"]' }),
  );
  const notes = await opened.loader.getHarness(
    MatInputHarness.with({ selector: '[data-testid="tuning-notes"]' }),
  );
  const save = await opened.loader.getHarness(
    MatButtonHarness.with({ selector: '[data-testid="save-details"]' }),
  );
  return { ...opened, name, notes, save };
}

describe('notBlank', () => {
  it('treats spaces, tabs and newlines as no name', () => {
    expect(notBlank(new FormControl(' \t\n', { nonNullable: true }))).toEqual({ required: true });
    expect(notBlank(new FormControl(' a ', { nonNullable: true }))).toBeNull();
  });
});

describe('TuningDetailsDialog', () => {
  beforeEach(() => TestBed.configureTestingModule({}));

  it('starts from the stored name and notes and closes with the trimmed name', async () => {
    const { name, notes, save, closed } = await open({ name: 'Flat', notes: 'Measured at MLP.' });
    expect(await name.getValue()).toBe('Flat');
    expect(await notes.getValue()).toBe('Measured at MLP.');
    await name.setValue('  Flat, revised ');
    await save.click();
    expect(closed()).toEqual({ value: { name: 'Flat, revised', notes: 'Measured at MLP.' } });
  });

  it('sends notes of spaces only as no notes', async () => {
    const { notes, save, closed } = await open({ name: 'Flat', notes: null });
    expect(await notes.getValue()).toBe('');
    await notes.setValue('   ');
    await save.click();
    expect(closed()?.value?.notes).toBeNull();
  });

  it('keeps the dialog open on a blank name, or one longer than the contract allows', async () => {
    const { name, save, closed, dialog } = await open({ name: 'Flat', notes: null });
    await name.setValue('   ');
    await save.click();
    expect(closed()).toBeUndefined();
    expect(await dialog.getContentText()).toContain('Give the tuning a name.');

    // The input's maxlength stops typing; a pasted value still goes through the validator.
    expect(await (await name.host()).getAttribute('maxlength')).toBe(String(NAME_MAX_LENGTH));
    await name.setValue('n'.repeat(NAME_MAX_LENGTH + 1));
    await save.click();
    expect(closed()).toBeUndefined();
  });

  it('counts the notes against their limit as they are typed', async () => {
    const { notes, dialog } = await open({ name: 'Flat', notes: null });
    await notes.setValue('abcde');
    expect(await dialog.getContentText()).toContain('5 / 4000');
  });
});
