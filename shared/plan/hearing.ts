/** NIOSH recommended exposure limit (Criteria for a Recommended Standard, 1998): 85 dBA over 8 h, 3 dB exchange rate. */
export const NIOSH_REL_DBA = 85;

/**
 * The hearing part of every caution about loud test signals: local occupational limits come first,
 * and one published figure is named so the level means something.
 */
export const HEARING_CAUTION =
  'Protect hearing and follow the occupational noise limits that apply where you work; for reference, ' +
  `NIOSH (Criteria for a Recommended Standard, 1998) recommends at most ${NIOSH_REL_DBA} dBA over 8 hours, halving the time for every 3 dB more. ` +
  'Calibration levels are usually read C-weighted; exposure limits are A-weighted.';
