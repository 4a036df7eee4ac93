import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { openDialog } from '../../../testing/dialogs';
import { demoChannels, demoTuning } from '../../../testing/fixtures';
import type { Tuning } from '../../tunings/tuning.model';
import { ApplyFitChoice, ApplyFitData, ApplyFitDialog } from './apply-fit-dialog';

function tuning(id: string, name: string, channels: string[]): Tuning {
  const [channel] = demoChannels();
  return demoTuning({
    id,
    name,
    version: 2,
    latestVersion: 2,
    channels: channels.map((c) => ({ ...channel, id: c })),
  });
}

const data: ApplyFitData = {
  tunings: [tuning('tun_a', 'Stereo', ['L', 'R']), tuning('tun_b', 'Full', ['L', 'R', 'C', 'LFE'])],
  channel: 'C',
  bandCount: 3,
};

describe('ApplyFitDialog', () => {
  beforeEach(() => TestBed.configureTestingModule({}));

  async function open(d: ApplyFitData = data) {
    const opened = await openDialog<ApplyFitDialog, ApplyFitChoice>(ApplyFitDialog, { data: d });
    const tuningSelect = await opened.loader.getHarness(
      MatSelectHarness.with({ selector: '[data-testid="apply-tuning"]' }),
    );
    const channelSelect = await opened.loader.getHarness(
      MatSelectHarness.with({ selector: '[data-testid="apply-channel"]' }),
    );
    const apply = await opened.loader.getHarness(
      MatButtonHarness.with({ selector: '[data-testid="apply-confirm"]' }),
    );
    return { ...opened, tuningSelect, channelSelect, apply };
  }

  it('offers the newest tuning and the measured channel, and applies there', async () => {
    const { tuningSelect, channelSelect, apply, closed, dialog } = await open();
    expect(await dialog.getContentText()).toContain('The 3 fitted bands replace the EQ');
    expect(await tuningSelect.getValueText()).toBe('Full (v2)');
    expect(await channelSelect.getValueText()).toBe('C (measured)');
    expect(await apply.getText()).toBe('Apply to C');
    await apply.click();
    expect(closed()).toEqual({ value: { tuningId: 'tun_b', channel: 'C' } });
  });

  it('falls back to the first channel of a tuning that lacks the measured one', async () => {
    const { tuningSelect, channelSelect, apply, closed } = await open();
    await tuningSelect.clickOptions({ text: 'Stereo (v2)' });
    expect(await channelSelect.getValueText()).toBe('L');
    await channelSelect.clickOptions({ text: 'R' });
    await apply.click();
    expect(closed()).toEqual({ value: { tuningId: 'tun_a', channel: 'R' } });
  });

  it('cannot apply when the chosen tuning has no channels', async () => {
    const { tuningSelect, apply, closed } = await open({
      ...data,
      tunings: [tuning('tun_empty', 'Empty', []), tuning('tun_a', 'Stereo', ['L', 'R'])],
      bandCount: 1,
    });
    await tuningSelect.clickOptions({ text: 'Empty (v2)' });
    expect(await apply.isDisabled()).toBe(true);
    expect(await apply.getText()).toBe('Apply to channel');
    expect(closed()).toBeUndefined();
  });
});
