import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { openDialog } from '../../../testing/dialogs';
import { ConfirmDialog, ConfirmDialogData } from './confirm-dialog';

const data: ConfirmDialogData = {
  title: 'Delete “Flat”?',
  message: 'Every version goes with it.',
  confirmLabel: 'Delete tuning',
  destructive: true,
};

describe('ConfirmDialog', () => {
  beforeEach(() => TestBed.configureTestingModule({}));

  it('closes with true only on the named action, styled as destructive', async () => {
    const { loader, closed, dialog } = await openDialog<ConfirmDialog, boolean>(ConfirmDialog, { data });
    expect(await dialog.getTitleText()).toBe('Delete “Flat”?');
    expect(await dialog.getContentText()).toBe('Every version goes with it.');
    const action = await loader.getHarness(MatButtonHarness.with({ text: 'Delete tuning' }));
    expect(await (await action.host()).hasClass('destructive')).toBe(true);
    await action.click();
    expect(closed()).toEqual({ value: true });
  });

  it('closes with false on Cancel, and Cancel has the first focus', async () => {
    const { loader, closed } = await openDialog<ConfirmDialog, boolean>(ConfirmDialog, {
      data: { ...data, destructive: false },
    });
    const cancel = await loader.getHarness(MatButtonHarness.with({ text: 'Cancel' }));
    expect(await (await cancel.host()).getAttribute('cdkFocusInitial')).not.toBeNull();
    const action = await loader.getHarness(MatButtonHarness.with({ text: 'Delete tuning' }));
    expect(await (await action.host()).hasClass('destructive')).toBe(false);
    await cancel.click();
    expect(closed()).toEqual({ value: false });
  });
});
