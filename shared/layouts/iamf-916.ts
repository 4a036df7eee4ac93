import { BS2051_LAYOUTS } from './bs2051';
import type { Layout, LayoutChannel } from './types';

/*
 * 9.1.6 is not a BS.2051 system. The open AOM IAMF specification (Immersive Audio Model and Formats,
 * expanded_loudspeaker_layout = 8, "9.1.6ch") defines it as "the subset of Loudspeaker configuration for
 * Sound System H (9+10+3) of [ITU-2051-3]" with the channels FL, FR, FC, LFE1, BL, BR, FLc, FRc, SiL,
 * SiR, TpFL, TpFR, TpBL, TpBR, TpSiL, TpSiR (read in the IAMF channel tables as published with the
 * AOM iamf-tools and Open Binaural Renderer documentation). The mapping of those names to BS.2051 labels
 * below is ours, by position (FL = front left at 60° = M+060, FLc = M+030, TpSiL = U+090, ...); every
 * row, with its permitted ranges, is then taken from system H so the two can never disagree.
 */
const IAMF_916_LABELS: ReadonlyArray<[iamfName: string, label: string]> = [
  ['FL', 'M+060'],
  ['FR', 'M-060'],
  ['FC', 'M+000'],
  ['LFE1', 'LFE1'],
  ['BL', 'M+135'],
  ['BR', 'M-135'],
  ['FLc', 'M+030'],
  ['FRc', 'M-030'],
  ['SiL', 'M+090'],
  ['SiR', 'M-090'],
  ['TpFL', 'U+045'],
  ['TpFR', 'U-045'],
  ['TpBL', 'U+135'],
  ['TpBR', 'U-135'],
  ['TpSiL', 'U+090'],
  ['TpSiR', 'U-090'],
];

function systemH(): Layout {
  const layout = BS2051_LAYOUTS.find((l) => l.system === 'H');
  if (!layout) throw new Error('system H is missing from the BS.2051 table');
  return layout;
}

function systemHChannel(label: string, iamfName: string): LayoutChannel {
  const channel = systemH().channels.find((c) => c.label === label);
  if (!channel) throw new Error(`system H has no ${label}`);
  return { ...channel, note: `IAMF channel ${iamfName}.${channel.note ? ' ' + channel.note : ''}` };
}

export const IAMF_916_LAYOUT: Layout = {
  id: 'iamf-9.1.6',
  system: null,
  name: '6+9+0',
  aliases: ['9.1.6'],
  title: '9.1.6 (subset of sound system H)',
  reference:
    'AOM IAMF specification, expanded loudspeaker layout 9.1.6ch: subset of ITU-R BS.2051-3 sound system H',
  channels: IAMF_916_LABELS.map(([iamfName, label]) => systemHChannel(label, iamfName)),
  rules: systemH().rules,
  notes: [
    '9.1.6 is not a BS.2051 system; the IAMF specification defines it as a subset of system H, whose positions and ranges apply.',
    'Upper-layer elevations follow system H (30..45°), which is lower than many 7.1.4 rooms use for their top loudspeakers.',
  ],
};
