/*
 * DEMO DATA — invented. Kestrel Yard Post is a fictional post-production house; Stage 3 is its
 * invented 7.1.4 mix room (PRODUCT.md §7). Every position and reading below is made up for the demo.
 *
 * Room 6.10 × 7.40 × 3.05 m, listening position on the centre line 3.30 m from the front wall at ear
 * height 1.20 m. The rear surrounds hang on a machine-room partition at y = 5.10 m, so they are closer
 * (2.55 m) than the fronts (3.12 m); the right top-back loudspeaker (U-135) was mounted 6° off its
 * nominal azimuth (−129° instead of −135°). The subwoofer (LFE1) stands on the floor near the front-left
 * corner.
 */

export const DEMO_ROOM_NOTE =
  'Demo data: invented room, positions and readings (Kestrel Yard Post is fictional).';

export const STAGE3_ROOM = {
  name: 'Stage 3',
  layout: '7.1.4',
  dimensions: { widthM: 6.1, lengthM: 7.4, heightM: 3.05 },
  listener: { x: 3.05, y: 3.3, z: 1.2 },
  loudspeakers: [
    { id: 'M+030', name: 'Left', x: 1.49, y: 0.6, z: 1.2 },
    { id: 'M-030', name: 'Right', x: 4.61, y: 0.6, z: 1.2 },
    { id: 'M+000', name: 'Centre', x: 3.05, y: 0.55, z: 1.15 },
    { id: 'LFE1', name: 'Subwoofer', x: 0.9, y: 0.5, z: 0.25 },
    { id: 'M+090', name: 'Left side surround', x: 0.25, y: 3.3, z: 1.2 },
    { id: 'M-090', name: 'Right side surround', x: 5.85, y: 3.3, z: 1.2 },
    { id: 'M+135', name: 'Left rear surround', x: 1.25, y: 5.1, z: 1.2 },
    { id: 'M-135', name: 'Right rear surround', x: 4.85, y: 5.1, z: 1.2 },
    { id: 'U+045', name: 'Left top front', x: 1.88, y: 2.13, z: 2.85 },
    { id: 'U-045', name: 'Right top front', x: 4.22, y: 2.13, z: 2.85 },
    { id: 'U+135', name: 'Left top back', x: 1.88, y: 4.47, z: 2.85 },
    { id: 'U-135', name: 'Right top back', x: 4.33, y: 4.34, z: 2.85 },
  ],
  limits: {
    delayMaxMs: 75,
    trimMinDb: -12,
    trimMaxDb: 12,
    eqBandsPerChannel: 8,
    eqMaxBoostDb: 3,
    eqMaxCutDb: 12,
  },
  sampleRateHz: 48000,
  notes: `${DEMO_ROOM_NOTE} Rear surrounds on the machine-room partition; U-135 mounted 6° off nominal.`,
};

/**
 * Invented SPL readings (dB C, slow) of pink noise at −20 dBFS RMS per channel at the listening position,
 * before any trim — demo data. The subwoofer reading is in-band with the LFE channel.
 */
export const STAGE3_SPL_DB: Record<string, number> = {
  'M+030': 80.6,
  'M-030': 80.9,
  'M+000': 81.8,
  LFE1: 90.2,
  'M+090': 82.3,
  'M-090': 82.0,
  'M+135': 83.1,
  'M-135': 82.7,
  'U+045': 79.4,
  'U-045': 79.8,
  'U+135': 80.2,
  'U-135': 79.1,
};

/** The room's reference level for the demo (a common small-room choice, common practice). */
export const STAGE3_REFERENCE_DB = 79;

/**
 * DEMO DATA — the processor profile Stage 3's outputs use: an invented, generic 8-band processor at 48 or
 * 96 kHz (delay in 0.01 ms steps up to 75 ms, trims in 0.1 dB, peaking and shelving bands, coefficients
 * with a negated feedback sign and nine decimals). Not modelled on any product.
 */
export const STAGE3_PROFILE = {
  name: 'Generic 8-band, 48/96 kHz (demo)',
  sampleRatesHz: [48000, 96000],
  delay: { unit: 'ms' as const, min: 0, max: 75, step: 0.01 },
  trimDb: { min: -12, max: 12, step: 0.1 },
  eq: {
    bandsPerChannel: 8,
    filterTypes: ['peaking' as const, 'lowShelf' as const, 'highShelf' as const],
    frequencyHz: { min: 20, max: 20000, step: 1 },
    frequencyStepUnit: 'hz' as const,
    gainDb: { min: -12, max: 6, step: 0.1 },
    q: { min: 0.3, max: 10, step: 0.01 },
  },
  coefficients: {
    order: ['b0' as const, 'b1' as const, 'b2' as const, 'a1' as const, 'a2' as const],
    feedbackSign: 'minus' as const,
    numberFormat: 'decimal' as const,
    decimalPlaces: 9,
  },
};
