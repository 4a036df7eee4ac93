import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { demoImpulseResponse } from '../../../testing/fixtures';
import { ImpulseResponseFacts, type ImpulseResponseFactsSource } from './ir-facts';

/** A whole analysis as the API answers it; the specs set the numbers they read. */
const base = demoImpulseResponse();

@Component({
  selector: 'iso-ir-facts-host',
  imports: [ImpulseResponseFacts],
  template: `<iso-ir-facts [analysis]="analysis()" />`,
})
class Host {
  readonly analysis = signal<ImpulseResponseFactsSource>({
    arrival: { ...base.arrival, arrivalMs: 8.1458 },
    level: { ...base.level, peakDbfs: -6.02, peakToNoiseDb: 71.26 },
    decay: { ...base.decay, edtS: 0.291, t20S: 0.3, t30S: null },
  });
}

function facts(element: HTMLElement): Array<[string, string]> {
  return Array.from(element.querySelectorAll('dl > div'), (row) => [
    row.querySelector('dt')!.textContent!.trim(),
    row.querySelector('dd')!.textContent!.trim(),
  ]);
}

describe('ImpulseResponseFacts', () => {
  beforeEach(() => TestBed.configureTestingModule({}));

  it('lists arrival, levels and decay times with units, a dash for a time not measured', async () => {
    const fixture = TestBed.createComponent(Host);
    await fixture.whenStable();
    expect(facts(fixture.nativeElement)).toEqual([
      ['Arrival', '8.15\u00a0ms'],
      ['Peak', '\u22126.0\u00a0dBFS'],
      ['Peak to noise', '71.3\u00a0dB'],
      ['EDT', '0.29\u00a0s'],
      ['T20', '0.30\u00a0s'],
      ['T30', '—'],
    ]);
  });

  it('adds the arrival after the loopback and the Schroeder frequency when the analysis has them', async () => {
    const fixture = TestBed.createComponent(Host);
    fixture.componentInstance.analysis.update((a) => ({
      ...a,
      timing: {
        referenceArrivalSample: 96,
        referenceArrivalMs: 2,
        referencePeakSample: 97,
        arrivalFromReferenceSamples: 241,
        arrivalFromReferenceMs: 5.0113,
        peakFromReferenceSamples: 242,
        peakFromReferenceMs: 5.0321,
      },
      room: { ...base.room!, schroederFrequencyHz: 164.4 },
    }));
    await fixture.whenStable();
    const rows = facts(fixture.nativeElement);
    expect(rows[1]).toEqual(['After the loopback', '5.01\u00a0ms']);
    expect(rows.at(-1)).toEqual(['Schroeder frequency', '164\u00a0Hz']);
  });
});
