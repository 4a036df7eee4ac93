import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { Component, signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { FILTER_LIMITS } from '../../../../../shared/filters/biquad-design';
import { TUNING_LIMITS } from '../../../../../shared/plan/tuning';
import type { FieldProblem } from '../../problem/problem-message';
import type { ProcessorLimits, TuningChannel, TuningChannelInput } from '../tuning.model';
import { ChannelEditor } from './channel-editor';

const left: TuningChannel = {
  id: 'L',
  delayMs: 1,
  trimDb: -1.5999999,
  polarity: 'normal',
  bassManaged: false,
  highPass: null,
  eq: [{ type: 'peaking', frequencyHz: 63, gainDb: -4, q: 4 }],
};

@Component({
  selector: 'iso-editor-host',
  imports: [ChannelEditor],
  template: `<iso-channel-editor
    [channel]="channel()"
    [sampleRateHz]="sampleRateHz()"
    [limits]="limits()"
    [readOnly]="readOnly()"
    [serverErrors]="serverErrors()"
    (save)="saved.push($event)"
    (dirtyChange)="dirty.push($event)"
  />`,
})
class Host {
  readonly channel = signal<TuningChannel>(left);
  readonly sampleRateHz = signal(48000);
  readonly limits = signal<ProcessorLimits | null>(null);
  readonly readOnly = signal(false);
  readonly serverErrors = signal<FieldProblem[]>([]);
  readonly saved: TuningChannelInput[] = [];
  readonly dirty: boolean[] = [];
}

describe('ChannelEditor', () => {
  let fixture: ComponentFixture<Host>;
  let loader: HarnessLoader;

  beforeEach(async () => {
    fixture = TestBed.createComponent(Host);
    fixture.detectChanges();
    await fixture.whenStable();
    loader = TestbedHarnessEnvironment.loader(fixture);
  });

  const input = (testId: string) =>
    loader.getHarness(MatInputHarness.with({ selector: `[data-testid="${testId}"]` }));
  const field = (testId: string) =>
    loader.getHarness(MatFormFieldHarness.with({ selector: `:has([data-testid="${testId}"])` }));
  const saveButton = () =>
    loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="save-channel"]' }));
  const text = () => fixture.nativeElement.textContent as string;

  async function settle() {
    fixture.detectChanges();
    await fixture.whenStable();
  }

  it('shows the stored settings at a sensible precision, with the delay in samples', async () => {
    expect(await (await input('field-delayMs')).getValue()).toBe('1');
    expect(await (await input('field-trimDb')).getValue()).toBe('-1.6');
    expect(await (await input('band-frequencyHz')).getValue()).toBe('63');
    expect(text()).toContain('48 samples at 48 kHz');
    expect(text()).toContain(`EQ bands (1 of ${TUNING_LIMITS.eqMaxSections})`);
    expect(await (await saveButton()).isDisabled()).toBe(true);
  });

  it('saves the edited channel as the API takes it, once something changed', async () => {
    await (await input('field-delayMs')).setValue('2.5');
    await (await input('band-gainDb')).setValue('-6');
    await (
      await loader.getHarness(MatSelectHarness.with({ selector: '[data-testid="field-polarity"]' }))
    ).clickOptions({
      text: 'Inverted',
    });
    expect(fixture.componentInstance.dirty).toContain(true);
    const save = await saveButton();
    expect(await save.isDisabled()).toBe(false);
    await save.click();
    expect(fixture.componentInstance.saved).toEqual([
      {
        id: 'L',
        delayMs: 2.5,
        trimDb: -1.6,
        polarity: 'inverted',
        bassManaged: false,
        highPass: null,
        eq: [{ type: 'peaking', frequencyHz: 63, gainDb: -6, q: 4 }],
      },
    ]);
  });

  it('refuses values outside the contract’s own bounds on the field', async () => {
    await (await input('field-trimDb')).setValue(String(TUNING_LIMITS.trimMaxDb + 1));
    expect(await (await field('field-trimDb')).getTextErrors()).toEqual([
      `At most ${TUNING_LIMITS.trimMaxDb}.`,
    ]);
    await (await input('band-q')).setValue('0');
    expect(await (await field('band-q')).getTextErrors()).toEqual([`At least ${FILTER_LIMITS.qMin}.`]);
    expect(await (await saveButton()).isDisabled()).toBe(true);
  });

  it('enforces the room’s limits as they are typed, in the room’s words', async () => {
    fixture.componentInstance.limits.set({ delayMaxMs: 20, eqMaxBoostDb: 3, eqMaxCutDb: 6 });
    await settle();
    expect(fixture.nativeElement.querySelector('[data-testid="room-limits"]').textContent).toContain('20');

    await (await input('field-delayMs')).setValue('25');
    expect(await (await field('field-delayMs')).getTextErrors()).toEqual([
      'The room allows delays up to 20 ms.',
    ]);
    expect(await (await saveButton()).isDisabled()).toBe(true);

    await (await input('field-delayMs')).setValue('19');
    expect(await (await field('field-delayMs')).getTextErrors()).toEqual([]);

    await (await input('band-gainDb')).setValue('5');
    expect(await (await field('band-gainDb')).getTextErrors()).toEqual([
      'The room allows boosts up to +3 dB.',
    ]);
    await (await input('band-gainDb')).setValue('-9');
    expect(await (await field('band-gainDb')).getTextErrors()).toEqual([
      'The room allows cuts down to \u22126 dB.',
    ]);
    await (await input('band-gainDb')).setValue('-5');
    expect(await (await saveButton()).isDisabled()).toBe(false);
  });

  it('counts bands against the room’s limit and says so when one too many is added', async () => {
    fixture.componentInstance.limits.set({ eqBandsPerChannel: 1 });
    await settle();
    expect(text()).toContain('EQ bands (1 of 1)');
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="add-band"]' }))).click();
    expect(fixture.nativeElement.querySelector('.problem').textContent).toContain(
      'The room allows 1 EQ bands per output.',
    );
    expect(await (await saveButton()).isDisabled()).toBe(true);
    await (
      await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Remove band 2"]' }))
    ).click();
    expect(fixture.nativeElement.querySelector('.problem')).toBeNull();
  });

  it('shows the API’s refusal on the field it names, and anything else above the plot', async () => {
    fixture.componentInstance.serverErrors.set([
      { pointer: '/eq/0/gainDb', message: 'The processor takes cuts down to −3 dB.' },
      { pointer: '/subwoofer', message: 'The subwoofer feed clips.' },
    ]);
    await settle();
    expect(await (await field('band-gainDb')).getTextErrors()).toEqual([
      'The processor takes cuts down to −3 dB.',
    ]);
    expect(text()).toContain('The subwoofer feed clips.');
  });

  it('gives a filter without gain no gain field, and keeps a high-pass off until chosen', async () => {
    const type = await loader.getHarness(MatSelectHarness.with({ selector: '.f-type mat-select' }));
    await type.clickOptions({ text: 'Notch' });
    expect(await (await input('band-gainDb')).isDisabled()).toBe(true);
    expect(text()).toContain('No gain for this type');

    const family = await loader.getHarness(
      MatSelectHarness.with({ selector: '[data-testid="field-highPassFamily"]' }),
    );
    const hz = await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="highPassHz"]' }));
    expect(await hz.isDisabled()).toBe(true);
    await family.clickOptions({ text: 'Linkwitz-Riley' });
    expect(await hz.isDisabled()).toBe(false);
    await hz.setValue('90');
    await (await saveButton()).click();
    const saved = fixture.componentInstance.saved[0];
    expect(saved.highPass).toEqual({ family: 'linkwitzRiley', order: 4, frequencyHz: 90 });
    expect(saved.eq).toEqual([{ type: 'notch', frequencyHz: 63, q: 4 }]);
  });

  it('keeps a stored bandwidth in octaves that the form does not edit', async () => {
    fixture.componentInstance.channel.set({
      ...left,
      eq: [{ type: 'peaking', frequencyHz: 100, gainDb: -3, bandwidthOctaves: 1 }],
    });
    await settle();
    await (await input('field-trimDb')).setValue('-2');
    await (await saveButton()).click();
    expect(fixture.componentInstance.saved[0].eq).toEqual([
      { type: 'peaking', frequencyHz: 100, gainDb: -3, bandwidthOctaves: 1 },
    ]);
  });

  it('discards changes back to the stored channel', async () => {
    await (await input('field-delayMs')).setValue('7');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Discard changes' }))).click();
    expect(await (await input('field-delayMs')).getValue()).toBe('1');
    expect(fixture.componentInstance.dirty.at(-1)).toBe(false);
  });

  it('shows an older version read-only, with nothing to save', async () => {
    fixture.componentInstance.readOnly.set(true);
    await settle();
    expect(await (await input('field-delayMs')).isDisabled()).toBe(true);
    expect(await (await input('band-q')).isDisabled()).toBe(true);
    expect(
      await loader.getAllHarnesses(MatButtonHarness.with({ selector: '[data-testid="save-channel"]' })),
    ).toEqual([]);
  });
  describe('crossover combinations the design refuses (shared/filters/crossover.ts)', () => {
    const highPassField = (name: 'highPassOrder' | 'highPassHz') =>
      loader.getHarness(MatFormFieldHarness.with({ selector: `:has([formControlName="${name}"])` }));
    const highPassInput = (name: 'highPassOrder' | 'highPassHz') =>
      loader.getHarness(MatInputHarness.with({ selector: `[formControlName="${name}"]` }));
    async function choose(familyText: 'Linkwitz-Riley' | 'Butterworth') {
      const family = await loader.getHarness(
        MatSelectHarness.with({ selector: '[data-testid="field-highPassFamily"]' }),
      );
      await family.clickOptions({ text: familyText });
    }

    // Linkwitz-Riley filters are squared Butterworths (S. H. Linkwitz, JAES 24(1), 1976): orders 2, 4, 8 here.
    it.each(['3', '1', '6', '5'])(
      'shows a Linkwitz-Riley of order %s refused on the order field',
      async (order) => {
        await choose('Linkwitz-Riley');
        // setValue clears the field first: an empty order on the way must not stop later checks.
        await (await highPassInput('highPassOrder')).setValue(order);
        expect(await (await highPassField('highPassOrder')).getTextErrors()).toEqual([
          `Order must be 2, 4 or 8 for a Linkwitz-Riley crossover; received ${order}.`,
        ]);
        expect(await (await saveButton()).isDisabled()).toBe(true);
        expect(fixture.nativeElement.querySelector('iso-chart')).toBeNull();
      },
    );

    it('takes the same order 3 as a Butterworth, and clears the refusal when the order is fixed', async () => {
      await choose('Linkwitz-Riley');
      await (await highPassInput('highPassOrder')).setValue('3');
      expect(await (await highPassField('highPassOrder')).getTextErrors()).toHaveLength(1);
      await choose('Butterworth');
      await settle();
      expect(await (await highPassField('highPassOrder')).getTextErrors()).toEqual([]);
      expect(await (await saveButton()).isDisabled()).toBe(false);
      await choose('Linkwitz-Riley');
      await (await highPassInput('highPassOrder')).setValue('8');
      expect(await (await highPassField('highPassOrder')).getTextErrors()).toEqual([]);
      expect(fixture.nativeElement.querySelector('iso-chart')).not.toBeNull();
    });

    it('refuses a non-whole order and one past the contract’s bound', async () => {
      await choose('Butterworth');
      await (await highPassInput('highPassOrder')).setValue('2.5');
      expect(await (await highPassField('highPassOrder')).getTextErrors()).toEqual([
        'Order must be an integer; received 2.5.',
      ]);
      await (await highPassInput('highPassOrder')).setValue('9');
      expect(await (await highPassField('highPassOrder')).getTextErrors()).toEqual(['At most 8.']);
      expect(await (await saveButton()).isDisabled()).toBe(true);
    });

    it('refuses a corner at or above Nyquist for the tuning’s rate on the corner field', async () => {
      fixture.componentInstance.sampleRateHz.set(44100);
      await settle();
      await choose('Linkwitz-Riley');
      await (await highPassInput('highPassHz')).setValue('22050');
      expect(await (await highPassField('highPassHz')).getTextErrors()).toEqual([
        'FrequencyHz must be at least 1 Hz and below 22050 Hz; received 22050 Hz.',
      ]);
      await (await highPassInput('highPassHz')).setValue('120');
      expect(await (await highPassField('highPassHz')).getTextErrors()).toEqual([]);
    });

    it('shows the API’s refusal of the order on the order field', async () => {
      await choose('Linkwitz-Riley');
      fixture.componentInstance.serverErrors.set([
        { pointer: '/highPass/order', message: 'The processor takes orders 2 and 4.' },
      ]);
      await settle();
      expect(await (await highPassField('highPassOrder')).getTextErrors()).toEqual([
        'The processor takes orders 2 and 4.',
      ]);
    });
  });

  it('names an EQ band at or above Nyquist of the tuning’s rate on its frequency, and draws nothing', async () => {
    fixture.componentInstance.sampleRateHz.set(44100);
    await settle();
    await (await input('band-frequencyHz')).setValue('23000');
    expect((await (await field('band-frequencyHz')).getTextErrors()).join(' ')).toContain('below 22050 Hz');
    expect(fixture.nativeElement.querySelector('[data-testid="channel-response"]')).toBeNull();
    expect(await (await saveButton()).isDisabled()).toBe(true);
  });
});
