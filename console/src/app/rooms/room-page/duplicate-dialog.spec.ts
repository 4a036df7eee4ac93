import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { NAME_MAX_LENGTH } from '../../../../../shared/limits';
import { openDialog } from '../../../testing/dialogs';
import { DuplicateDialog, NameDialogData } from './duplicate-dialog';

async function open(data: NameDialogData) {
  const opened = await openDialog<DuplicateDialog, string>(DuplicateDialog, { data });
  const input = await opened.loader.getHarness(
    MatInputHarness.with({ selector: '[data-testid="duplicate-name"]' }),
  );
  const confirm = await opened.loader.getHarness(
    MatButtonHarness.with({ selector: '[data-testid="confirm-duplicate"]' }),
  );
  return { ...opened, input, confirm };
}

describe('DuplicateDialog', () => {
  beforeEach(() => TestBed.configureTestingModule({}));

  it('offers the given name and closes with it trimmed', async () => {
    const { input, confirm, closed } = await open({ title: 'Duplicate', name: 'Bass-managed 80 Hz (copy)' });
    expect(await input.getValue()).toBe('Bass-managed 80 Hz (copy)');
    await input.setValue('  Variant B  ');
    await confirm.click();
    expect(closed()).toEqual({ value: 'Variant B' });
  });

  it('refuses a name of spaces only: the dialog stays open and says why', async () => {
    const { input, confirm, closed, loader } = await open({ title: 'Duplicate', name: 'x' });
    await input.setValue('     ');
    await confirm.click();
    expect(closed()).toBeUndefined();
    const field = await loader.getHarness(MatFormFieldHarness);
    expect(await field.getTextErrors()).toEqual(['Give it a name.']);
  });

  it('refuses an empty name too', async () => {
    const { input, confirm, closed } = await open({ title: 'Duplicate', name: 'x' });
    await input.setValue('');
    await confirm.click();
    expect(closed()).toBeUndefined();
  });

  it('cuts an offered name to the contract’s name limit so it can be saved as it stands', async () => {
    const { input, confirm, closed } = await open({
      title: 'Duplicate',
      name: 'n'.repeat(NAME_MAX_LENGTH + 30),
    });
    expect((await input.getValue()).length).toBe(NAME_MAX_LENGTH);
    await confirm.click();
    expect(closed()?.value).toHaveLength(NAME_MAX_LENGTH);
  });

  it('names its action and lead when asked to, and closes with nothing on Cancel', async () => {
    const { loader, dialog, closed } = await open({
      title: 'New tuning',
      name: 'Flat',
      lead: 'Starts from the room’s plan.',
      action: 'Create',
    });
    expect(await dialog.getTitleText()).toBe('New tuning');
    expect(await dialog.getContentText()).toContain('Starts from the room’s plan.');
    await loader.getHarness(MatButtonHarness.with({ text: 'Create' }));
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Cancel' }))).click();
    // `mat-dialog-close` without a value closes with '' — no name, so the opener makes nothing.
    expect(closed()).toBeDefined();
    expect(closed()?.value).toBeFalsy();
  });
});
