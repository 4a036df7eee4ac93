import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { DecayRequestControl } from './decay-request';
import { DEFAULT_DECAY_REQUEST, type DecayRequest } from './decay-scale';

@Component({
  selector: 'iso-decay-request-host',
  imports: [DecayRequestControl],
  template: `<iso-decay-request [(value)]="request" note="Asked for with the upload." />`,
})
class Host {
  readonly request = signal<DecayRequest>({ ...DEFAULT_DECAY_REQUEST });
}

describe('DecayRequestControl', () => {
  beforeEach(() => TestBed.configureTestingModule({}));

  it('asks for the plots ticked, with slices and bins checked against the contract limits', async () => {
    const fixture = TestBed.createComponent(Host);
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const element = fixture.nativeElement as HTMLElement;
    expect(element.textContent).toContain('Asked for with the upload.');
    // Slices and bins are only offered once a plot is asked for.
    expect(await loader.getAllHarnesses(MatInputHarness)).toHaveLength(0);
    await (await loader.getHarness(MatCheckboxHarness.with({ label: 'Waterfall' }))).check();
    await (await loader.getHarness(MatCheckboxHarness.with({ label: 'Spectrogram' }))).check();
    expect(fixture.componentInstance.request()).toEqual({
      waterfall: true,
      spectrogram: true,
      slices: 32,
      bins: 96,
    });
    const [slices, bins] = await loader.getAllHarnesses(MatInputHarness);
    await slices.setValue('200');
    await slices.blur();
    await bins.setValue('64');
    await bins.blur();
    await fixture.whenStable();
    expect(fixture.componentInstance.request()).toMatchObject({ slices: 200, bins: 64 });
    expect(element.textContent).toContain('Give 2 to 128 slices.');
    expect(element.textContent).toContain('16–256, 20 Hz to 20 kHz');
  });
});
