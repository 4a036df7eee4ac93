import type { GeometryResult } from '../../shared/geometry';
import type { Layout } from '../../shared/layouts';
import type { Caution } from '../../shared/notices';
import type { DesignedTuning, TuningSettings } from '../../shared/plan';
import type { SignOff, Status, Verification } from '../../shared/verification';
import { responseGrid } from '../../shared/dsp/grid';
import { cascadeResponse } from '../../shared/dsp/response';
import { esc, num, signed } from './report-html';
import { responseSvg } from './response-svg';
import { topViewLegend, topViewSvg } from './top-view-svg';

export interface RoomReportInput {
  room: {
    name: string;
    notes: string | null;
    dimensions: { widthM: number; lengthM: number; heightM: number };
    listener: { x: number; y: number; z: number };
    loudspeakers: ReadonlyArray<{ id: string; name?: string; x: number; y: number; z: number }>;
  };
  layout: Layout | undefined;
  geometry: GeometryResult;
  tuning: {
    name: string;
    version: number;
    notes: string | null;
    createdAt: Date;
    tunedBy: string;
    settings: TuningSettings;
    designed: DesignedTuning;
    cautions: Caution[];
    /** Set when the room changed since the settings were made: the report says so first. */
    stale: { since: string; reasons: string[] } | null;
  } | null;
  /** The tuning version's verification, with the "before" averages for the plots, and its sign-off. */
  verification?: {
    result: Verification;
    before: ReadonlyArray<{ channel: string; frequenciesHz: number[]; magnitudeDb: number[] }>;
    signOff: SignOff | null;
  } | null;
  generatedAt: Date;
}

const STATUS_TEXT: Record<Status | 'incomplete', string> = {
  pass: '<span class="ok">pass</span>',
  warn: '<span class="warn">warn</span>',
  fail: '<span class="bad">fail</span>',
  notMeasured: '<span class="na">not measured</span>',
  incomplete: '<span class="na">incomplete</span>',
};

/** Mean of a response from 100 Hz to 10 kHz (or over all of it), the 0 dB of the before/after plots. */
function levelOf(r: { frequenciesHz: readonly number[]; magnitudeDb: readonly number[] }): number {
  const inBand = r.magnitudeDb.filter((_, i) => r.frequenciesHz[i] >= 100 && r.frequenciesHz[i] <= 10000);
  const use = inBand.length > 0 ? inBand : r.magnitudeDb;
  return use.reduce((a, b) => a + b, 0) / use.length;
}

function verificationPart(v: NonNullable<RoomReportInput['verification']>, version: number): string {
  const r = v.result;
  const rows = r.channels.map((c) => {
    const a = c.arrival;
    const l = c.level;
    const resp = c.response;
    const x = c.crossoverSum;
    return `<tr><td>${esc(c.id)}</td><td class="n">${a.deviationMs === null ? '—' : signed(a.deviationMs, 3)}</td><td>${STATUS_TEXT[a.status]}</td><td class="n">${num(l.measuredDb, 1)} / ${num(l.expectedDb, 1)}</td><td class="n">${signed(l.deviationDb, 2)}</td><td>${STATUS_TEXT[l.status]}</td><td class="n">${num(resp.rmsDb, 2)} / ${signed(resp.largestDb, 1)}${resp.largestAtHz === null ? '' : ` @ ${num(resp.largestAtHz, 0)} Hz`}</td><td>${STATUS_TEXT[resp.status]}</td><td class="n">${signed(x.deepestDipDb, 1)}</td><td>${STATUS_TEXT[x.status]}</td></tr>`;
  });
  const table = `<table><thead><tr><th>Channel</th><th>Arrival vs median ms</th><th></th><th>Level measured / expected dB</th><th>Δ dB</th><th></th><th>Response RMS / largest dB</th><th></th><th>Crossover dip dB</th><th></th></tr></thead><tbody>${rows.join('')}</tbody></table>`;
  const tolerances = `<ul class="notices">${r.tolerances
    .map(
      (t) =>
        `<li><strong>${esc(t.name)}</strong> ${num(t.value, 2)}${t.setByCaller ? ` (default ${num(t.default, 2)})` : ''} — ${t.basis === 'published' ? 'published' : 'common practice'}: ${esc(t.source)}</li>`,
    )
    .join('')}</ul>`;
  const plots = r.responses
    .map((after) => {
      const before = v.before.find((b) => b.channel === after.channel);
      const zero = levelOf(after);
      const shift = (x: { frequenciesHz: number[]; magnitudeDb: number[] }) => ({
        frequenciesHz: x.frequenciesHz,
        magnitudeDb: x.magnitudeDb.map((db) => db - zero),
      });
      const beforeShifted = before
        ? shift({ ...before, magnitudeDb: before.magnitudeDb.map((db) => db - levelOf(before) + zero) })
        : undefined;
      const a = shift(after);
      return `<div class="plot"><p>${esc(after.channel)}</p>${responseSvg(a.frequenciesHz, a.magnitudeDb, `Before and after response of ${after.channel}`, beforeShifted)}</div>`;
    })
    .join('');
  const s = v.signOff;
  const signOff = s
    ? `<table class="signoff"><tbody><tr><th>Engineer</th><td>${esc(s.engineer)}</td><th>Date</th><td>${esc(s.date)}</td></tr><tr><th>Reference level</th><td>${num(s.referenceLevelDb, 1)} dB ${esc(s.weighting)}-weighted</td><th>Microphone</th><td>${esc(s.microphone)}</td></tr><tr><th>Positions</th><td>${esc(s.positions.join(', '))}</td><th>Verdict when signed</th><td>${STATUS_TEXT[s.verdict ?? 'incomplete']}</td></tr>${s.notes ? `<tr><th>Notes</th><td colspan="3">${esc(s.notes)}</td></tr>` : ''}</tbody></table>`
    : '<p>Not signed off.</p>';
  return `<section><h2>Verification — version ${version}: ${STATUS_TEXT[r.verdict]}</h2>
<p class="meta">"After" measurements taken with this version loaded${r.micPosition ? `, arrivals and levels at position ${esc(r.micPosition)}` : ''}; reference ${r.referenceDb === null ? 'not known' : `${num(r.referenceDb, 1)} dB`}${r.referenceFrom === 'medianOfMeasured' ? ' (median of the measured channels)' : ''}. Arrival spread ${r.arrivalSpread.spreadMs === null ? 'not measured' : `${num(r.arrivalSpread.spreadMs, 3)} ms`} ${STATUS_TEXT[r.arrivalSpread.status]}.</p>
${table}
<p class="meta">Pass within the tolerance, warn past 80 % of it, fail beyond it. Tolerances:</p>${tolerances}
${r.notes.length ? `<ul class="notices">${r.notes.map((n) => `<li>${esc(n)}</li>`).join('')}</ul>` : ''}
<h2>Responses before and after</h2><p class="meta">Solid: after (with this version loaded); dashed: before. Each at its own mean level from 100 Hz to 10 kHz (0 dB), averaged over the microphone positions.</p>
<div class="plots">${plots || '<p>No responses were measured after.</p>'}</div>
<h2>Sign-off</h2>${signOff}</section>`;
}

const STYLE = `
@page { size: A4; margin: 16mm 14mm; }
* { box-sizing: border-box; }
body { font: 10.5pt/1.4 "Helvetica Neue", Arial, sans-serif; color: #1a1a1a; margin: 0 auto; max-width: 190mm; padding: 8mm 0; }
h1 { font-size: 19pt; margin: 0 0 2mm; } h2 { font-size: 13pt; margin: 7mm 0 2mm; border-bottom: 1.5px solid #1d5a85; padding-bottom: 1mm; }
.stale { border: 2px solid #a11; color: #a11; padding: 2mm 3mm; margin: 0 0 4mm; }
.meta { color: #444; margin: 0 0 4mm; } .demo { color: #8a5300; }
table { border-collapse: collapse; width: 100%; font-size: 9pt; } th, td { padding: 1.2mm 1.6mm; border-bottom: 0.5px solid #ccc; text-align: left; vertical-align: top; }
th { background: #eef3f7; font-weight: 600; } td.n { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
.ok { color: #1d6b2f; } .bad { color: #a4211b; font-weight: 600; } .warn { color: #8a5300; font-weight: 600; } .na { color: #777; }
table.signoff th { width: 22%; }
.plots { display: flex; flex-wrap: wrap; gap: 3mm; } .plot { break-inside: avoid; } .plot p { margin: 0; font-size: 8.5pt; font-weight: 600; }
.legend span { margin-right: 5mm; white-space: nowrap; }
.mk { display: inline-block; width: 11px; height: 11px; margin-right: 1.5mm; vertical-align: middle; -webkit-print-color-adjust: exact; print-color-adjust: exact; }
.mk-circle { border-radius: 50%; } .mk-rectRot { transform: rotate(45deg) scale(0.8); } .mk-triangle { clip-path: polygon(50% 0, 100% 100%, 0 100%); }
.mk-ring { border: 2px solid; border-radius: 50%; width: 9px; height: 9px; background: none; }
ul.notices li { margin-bottom: 1.5mm; } .caution { border-left: 3px solid #a4551b; padding-left: 3mm; }
footer { margin-top: 8mm; font-size: 8.5pt; color: #555; border-top: 0.5px solid #ccc; padding-top: 2mm; }
section { break-inside: auto; } tr { break-inside: avoid; }
`;

function geometryTable(input: RoomReportInput): string {
  const rows = input.geometry.speakers.map((g) => {
    const name = input.room.loudspeakers.find((s) => s.id === g.id)?.name ?? '';
    const state =
      g.withinTolerance === null
        ? '—'
        : g.withinTolerance
          ? '<span class="ok">within</span>'
          : '<span class="bad">outside</span>';
    return `<tr><td>${esc(g.id)}</td><td>${esc(name)}</td><td class="n">${num(g.distanceM, 3)}</td><td class="n">${signed(g.azimuthDeg, 1)}°</td><td class="n">${signed(g.elevationDeg, 1)}°</td><td class="n">${g.nominal ? `${signed(g.nominal.azimuthDeg, 0)}° / ${signed(g.nominal.elevationDeg, 0)}°` : '—'}</td><td class="n">${g.deviation ? `${g.deviation.azimuthDeg === null ? '—' : signed(g.deviation.azimuthDeg, 1) + '°'} / ${signed(g.deviation.elevationDeg, 1)}°` : '—'}</td><td>${state}</td></tr>`;
  });
  return `<table><thead><tr><th>Channel</th><th>Name</th><th>Distance m</th><th>Azimuth</th><th>Elevation</th><th>Nominal az / el</th><th>Deviation az / el</th><th>BS.2051 range</th></tr></thead><tbody>${rows.join('')}</tbody></table>`;
}

function crossoverText(spec: { family: string; order: number; frequencyHz: number } | null): string {
  if (!spec) return 'full range';
  return `${spec.family === 'linkwitzRiley' ? 'LR' : 'BW'}${spec.order} ${num(spec.frequencyHz, 0)} Hz`;
}

function settingsTable(tuning: NonNullable<RoomReportInput['tuning']>): string {
  const rows = tuning.settings.channels.map((c, i) => {
    const designed = tuning.designed.channels[i];
    const eq =
      c.eq.length === 0
        ? '—'
        : c.eq
            .map(
              (f) =>
                `${esc(f.type)} ${num(f.frequencyHz, 1)} Hz ${f.gainDb === undefined ? '' : signed(f.gainDb, 1) + ' dB'}${f.q === undefined ? '' : ' Q ' + num(f.q, 2)}`,
            )
            .join('<br>');
    const sub =
      tuning.settings.subwoofer?.channel === c.id
        ? `low-pass ${crossoverText(tuning.settings.subwoofer.lowPass)}`
        : crossoverText(c.highPass);
    return `<tr><td>${esc(c.id)}</td><td class="n">${num(c.delayMs, 3)}</td><td class="n">${designed.delaySamples}</td><td class="n">${signed(c.trimDb, 1)}</td><td>${esc(c.polarity)}</td><td>${esc(sub)}</td><td>${eq}</td></tr>`;
  });
  return `<table><thead><tr><th>Channel</th><th>Delay ms</th><th>Samples @ ${tuning.designed.sampleRateHz / 1000} kHz</th><th>Trim dB</th><th>Polarity</th><th>Crossover</th><th>EQ</th></tr></thead><tbody>${rows.join('')}</tbody></table>`;
}

function responsePlots(tuning: NonNullable<RoomReportInput['tuning']>): string {
  const fs = tuning.designed.sampleRateHz;
  const grid = responseGrid({ fromHz: 20, toHz: Math.min(20000, 0.45 * fs), pointsPerOctave: 24 }, fs);
  return tuning.designed.channels
    .map((c) => {
      const magnitude = cascadeResponse(c.sections, grid, fs).magnitudeDb.map((db) => db + c.trimDb);
      return `<div class="plot"><p>${esc(c.id)}</p>${responseSvg(grid, magnitude, `Correction response of ${c.id}`)}</div>`;
    })
    .join('');
}

function notices(
  title: string,
  items: ReadonlyArray<{ code: string; channel?: string; message: string }>,
  cls = '',
): string {
  if (items.length === 0) return `<h2>${esc(title)}</h2><p>None.</p>`;
  return `<h2>${esc(title)}</h2><ul class="notices ${cls}">${items.map((w) => `<li>${w.channel ? `<strong>${esc(w.channel)}</strong>: ` : ''}${esc(w.message)}</li>`).join('')}</ul>`;
}

/**
 * The client's report for a room as one print-ready HTML page with no external assets: room and layout,
 * a top view (inline SVG), each loudspeaker's distance, angles and deviation from the layout, the
 * tuning's settings per channel, the response each channel's correction gives (trim, EQ and crossover
 * filters, from cascadeResponse), warnings, cautions, the date and who tuned it. Every stored string is
 * HTML-escaped.
 */
export function renderRoomReport(input: RoomReportInput): string {
  const { room, tuning, layout } = input;
  const title = `${room.name} — calibration report`;
  const legend = topViewLegend(room.loudspeakers.map((s) => s.id));
  const tuningPart = tuning
    ? `<section><h2>Settings — ${esc(tuning.name)} (version ${tuning.version})</h2>
<p class="meta">Tuned by ${esc(tuning.tunedBy)} on ${esc(tuning.createdAt.toISOString().slice(0, 10))}. Design sample rate ${tuning.designed.sampleRateHz} Hz.${tuning.notes ? ' ' + esc(tuning.notes) : ''}</p>
${settingsTable(tuning)}
${tuning.settings.subwoofer ? `<p>Subwoofer on ${esc(tuning.settings.subwoofer.channel)}: LFE gain ${signed(tuning.settings.subwoofer.lfeGainDb, 1)} dB${tuning.settings.subwoofer.headroomDb === undefined ? '' : `, summing headroom needed ${num(tuning.settings.subwoofer.headroomDb, 1)} dB`}.</p>` : ''}
<h2>Correction responses</h2><p class="meta">Magnitude of each channel's correction (trim, EQ and crossover filters) as designed at ${tuning.designed.sampleRateHz} Hz; the room's own response adds to it.</p>
<div class="plots">${responsePlots(tuning)}</div></section>`
    : '<h2>Settings</h2><p>No tuning is stored for this room yet.</p>';
  const cautions = tuning?.cautions ?? [];
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>${esc(title)}</title><style>${STYLE}</style></head>
<body>
${tuning?.stale ? `<p class="stale" role="alert"><strong>These settings are stale.</strong> The room changed on ${esc(tuning.stale.since.slice(0, 16).replace('T', ' '))} UTC after they were made: ${esc(tuning.stale.reasons.join('; '))}. Re-plan or re-check before loading them.</p>` : ''}
<header><h1>${esc(room.name)}</h1>
<p class="meta">Calibration report · ${esc(layout ? `${layout.title}${layout.aliases.length ? ' (' + layout.aliases.join(', ') + ')' : ''}` : 'unknown layout')} · room ${num(room.dimensions.widthM, 2)} × ${num(room.dimensions.lengthM, 2)} × ${num(room.dimensions.heightM, 2)} m · listening position x ${num(room.listener.x, 2)}, y ${num(room.listener.y, 2)}, ear height ${num(room.listener.z, 2)} m · generated ${esc(input.generatedAt.toISOString().slice(0, 16).replace('T', ' '))} UTC</p>
${room.notes ? `<p class="meta demo">${esc(room.notes)}</p>` : ''}</header>
<section><h2>Layout seen from above</h2>${topViewSvg({ dimensions: room.dimensions, listener: room.listener, loudspeakers: room.loudspeakers, geometry: input.geometry.speakers, layout })}${legend}</section>
<section><h2>Loudspeaker positions</h2><p class="meta">Azimuth positive to the left, elevation positive up, seen from the listening position (ITU-R BS.2051). Ranges widened by ±${num(input.geometry.angleToleranceDeg, 1)}° for measuring error.</p>${geometryTable(input)}</section>
${tuningPart}
${tuning && input.verification ? verificationPart(input.verification, tuning.version) : ''}
${notices('Warnings', input.geometry.warnings)}
${notices('Cautions', cautions, 'caution')}
<footer>Isochron computes settings from the data given; it does not certify a room. Calibration uses loud test signals: start quietly and protect hearing within the occupational noise limits that apply where you work. Mounting loudspeakers overhead and running power or signal cabling are for qualified installers under local codes. Biquad sections are normalised a0 = 1, H(z) = (b0 + b1 z⁻¹ + b2 z⁻²) / (1 + a1 z⁻¹ + a2 z⁻²).</footer>
</body></html>`;
}
