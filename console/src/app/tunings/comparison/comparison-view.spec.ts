import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatTableHarness } from '@angular/material/table/testing';
import type { TuningComparison } from '../tuning.model';
import { ComparisonView } from './comparison-view';

const comparison: TuningComparison = {
  identical: false,
  left: { tuningId: 'tun_a', name: 'Stereo', version: 2 },
  right: { tuningId: 'tun_b', name: 'Full', version: 5 },
  subwoofer: { lfeGainDbDifference: -2, lowPassChanged: true },
  channels: [
    {
      id: 'M+030',
      presentIn: 'both',
      delayMsDifference: 0.25,
      trimDbDifference: -1.5,
      polarityChanged: true,
      highPassChanged: true,
      bassManagedChanged: true,
      eqChanged: true,
      eqBands: { left: 2, right: 3 },
      maxResponseDifferenceDb: 4.2,
    },
    {
      id: 'U+045',
      presentIn: 'right',
      delayMsDifference: null,
      trimDbDifference: null,
      polarityChanged: false,
      highPassChanged: false,
      bassManagedChanged: false,
      eqChanged: false,
      eqBands: { left: 0, right: 1 },
      maxResponseDifferenceDb: null,
    },
  ],
};

describe('ComparisonView', () => {
  async function render(value: TuningComparison) {
    const fixture = TestBed.createComponent(ComparisonView);
    fixture.componentRef.setInput('comparison', value);
    fixture.detectChanges();
    await fixture.whenStable();
    return fixture;
  }

  it('lists what changed per channel, right minus left, and marks channels only one side has', async () => {
    const fixture = await render(comparison);
    const text = (fixture.nativeElement as HTMLElement).textContent!.replace(/\s+/g, ' ');
    expect(text).toContain('Differences from “Stereo” (v2) to “Full” (v5).');
    expect(text).toContain('subwoofer low-pass changed');
    const table = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatTableHarness);
    const columns = await table.getCellTextByColumnName();
    expect(columns['id'].text).toEqual(['M+030', 'U+045only right']);
    expect(columns['polarity'].text).toEqual(['changed', '—']);
    expect(columns['highPass'].text).toEqual(['high-pass changed, bass management changed', '—']);
    expect(columns['eq'].text).toEqual(['2 → 3 (changed)', '0 → 1']);
  });

  it('says so when both sides have the same settings, without a table', async () => {
    const fixture = await render({ ...comparison, identical: true, channels: [] });
    const element = fixture.nativeElement as HTMLElement;
    expect(element.textContent).toContain('“Stereo” v2 and “Full” v5 have the same settings.');
    expect(element.querySelector('table')).toBeNull();
  });
});
