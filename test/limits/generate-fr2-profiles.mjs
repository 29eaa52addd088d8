// Writes the shipped 3GPP FR2 UE profiles to templates/limits/*.yaml.
// Run: node test/limits/generate-fr2-profiles.mjs   (the YAML files are committed; this script
// only exists so that 54 files are typed once, from one hand-transcribed table).
// Numbers transcribed from /work/shared/reference/fr2-requirements.md, which collects
// 3GPP TS 38.101-2 V19.4.0 (2026-03), Rel-19. test/limits/profiles.test.ts re-reads that
// markdown independently and compares every number.
import { writeFileSync, readdirSync, unlinkSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Document } from 'yaml';

const OUT = fileURLToPath(new URL('../../templates/limits/', import.meta.url));
const SPEC = '3GPP TS 38.101-2 V19.4.0 (2026-03), Rel-19';
const VERIFY = 'verify against the current release';

// Table 5.2-1 (TDD bands), MHz.
const BANDS = {
  n257: [26500, 29500], n258: [24250, 27500], n259: [39500, 43500], n260: [37000, 40000],
  n261: [27500, 28350], n262: [47200, 48200], n263: [57000, 71000],
};
const CLASS_NAMES = {
  1: 'fixed wireless access', 2: 'vehicular', 3: 'handheld', 4: 'high-power non-handheld',
  5: 'fixed wireless access', 7: 'RedCap',
};
// Clause 6.2.1.x: [percentile, { band: [minPeak, maxTrp, maxEirp, sphCoverage] }]; null = not specified.
const TX = {
  1: [85, { n257: [40.0, 35, 55, 32.0], n258: [40.0, 35, 55, 32.0], n260: [38.0, 35, 55, 30.0],
    n261: [40.0, 35, 55, 32.0], n262: [34.2, 35, 55, 26.0], n263: [30.6, 25, 40, 19.1] }],
  2: [60, { n257: [29, 23, 43, 18.0], n258: [29, 23, 43, 18.0], n259: [25, 23, 43, 12.5],
    n261: [29, 23, 43, 18.0], n262: [22.9, 23, 43, 11.0], n263: [22.7, 23, 43, 7.6] }],
  3: [50, { n257: [22.4, 23, 43, 11.5], n258: [22.4, 23, 43, 11.5], n259: [18.7, 23, 43, 5.8],
    n260: [20.6, 23, 43, 8], n261: [22.4, 23, 43, 11.5], n262: [16.0, 23, 43, 2.9],
    n263: [14.1, 25, 43, 2.3] }],
  4: [20, { n257: [34, 23, 43, 25], n258: [34, 23, 43, 25], n260: [31, 23, 43, 19],
    n261: [34, 23, 43, 25], n262: [28.3, 23, 43, 16.2] }],
  5: [85, { n257: [30, null, null, 22], n258: [30.4, null, null, 22.4], n259: [27.7, null, null, 19.7] }],
  7: [50, { n257: [16.4, null, null, 5.5], n258: [16.4, null, null, 5.5], n261: [16.4, null, null, 5.5] }],
};
// PC3 receive, dBm, per channel bandwidth 50/100/200/400 MHz: [REFSENS[], EIS spherical coverage[]].
const BW = [50, 100, 200, 400];
const RX_N257 = [[-88.3, -85.3, -82.3, -79.3], [-77.4, -74.4, -71.4, -68.4]];
const RX = {
  n257: RX_N257, n258: RX_N257, n261: RX_N257,
  n259: [[-84.7, -81.7, -78.7, -75.7], [-71.9, -68.9, -65.9, -62.9]],
  n260: [[-85.7, -82.7, -79.7, -76.7], [-73.1, -70.1, -67.1, -64.1]],
  n262: [[-82.8, -79.8, -76.8, -73.8], [-69.7, -66.7, -63.7, -60.7]],
};

function header(lines) {
  return [...lines,
    `Values copied from ${SPEC}: ${VERIFY}.`,
    'Engineering data for development testing: passing this profile is not a conformance claim.',
    'Test tolerance is 0 dB in every check: add your own agreed values (tolerance_db) per check.',
  ].map((l) => `# ${l}`).join('\n') + '\n';
}

function write(name, headLines, body) {
  const doc = new Document(body);
  doc.get('frequency_range_mhz', true).flow = true;
  writeFileSync(`${OUT}${name}.yaml`, header(headLines) + doc.toString({ lineWidth: 100, minContentWidth: 40 }));
}

for (const f of readdirSync(OUT)) if (f.startsWith('3gpp-fr2-') && f.endsWith('.yaml')) unlinkSync(`${OUT}${f}`);

// Table 6.2.1.3-4 (multi-band relaxations, PC3; PC7 uses the PC3 values), dB: [peak, coverage].
const MB_PC3 = {
  n257: [0.7, 0.7], n258: [0.6, 0.7], n259: [0.5, 0.4], n260: [0.5, 0.4], n261: [0.5, 0.7],
  n262: [0.7, 0.7], n263: [1.0, 1.0],
};
// PC5: 0.7/0.7 except n259 0.5/0.5 (reference notes, "Rules attached to the transmit tables").
const MB = { 3: MB_PC3, 7: MB_PC3, 5: { n257: [0.7, 0.7], n258: [0.7, 0.7], n259: [0.5, 0.5] } };
/** Classes whose spherical-coverage minimum is 2 dB lower in initial access / RRC_INACTIVE. */
const INITIAL_ACCESS = [1, 3, 5, 7];
const INITIAL_ACCESS_DB = 2;
/** 1 decimal place arithmetic without float noise (0.1 dB is the tables' resolution). */
const dec = (x) => Math.round(x * 1000) / 1000;

/** Table numbers confirmed by reading S1 (reference notes, "Table numbers"). */
function txTable(pc, n) {
  if (String(pc) === '5' && n === 3) return 'Table 6.2.1.5-3 (printed as "Table 6.2.1.4-3" in the specification, a caption typo; the text calls it 6.2.1.5-3)';
  return `Table 6.2.1.${pc}-${n}`;
}

for (const [pc, [pct, bands]] of Object.entries(TX)) {
  for (const [band, [minPeak, maxTrp, maxEirp, sph]] of Object.entries(bands)) {
    const clause = `${SPEC}, clause 6.2.1.${pc}`;
    const coverageText = `minimum EIRP at the ${pct} %-tile of the CDF of total EIRP over the full sphere`;
    const peakCheck = (limit, extra = '') => ({ kind: 'min-peak', name: 'minimum peak EIRP', limit,
      source: `${clause}, ${txTable(pc, 1)}${extra}; ${VERIFY}` });
    const coverageCheck = (limit, extra = '') => ({ kind: 'percentile', name: `spherical coverage EIRP (${pct} %-tile)`, level_pct: pct, limit,
      source: `${clause}, ${txTable(pc, 3)}${extra}: ${coverageText}; ${VERIFY}` });
    const maxChecks = maxTrp === null ? [] : [
      { kind: 'max-trp', name: 'maximum TRP', limit: maxTrp, source: `${clause}, ${txTable(pc, 2)}; ${VERIFY}` },
      { kind: 'max-peak', name: 'maximum EIRP', limit: maxEirp, source: `${clause}, ${txTable(pc, 2)}; ${VERIFY}` },
    ];
    const notes = [
      `Power class ${pc} (${CLASS_NAMES[pc]}) UE, band ${band}, transmit.`,
      `Spherical coverage: the EIRP at the ${pct} % CDF level must reach the limit, i.e. at least ${100 - pct} % of the sphere by solid angle reaches it.`,
    ];
    if (maxTrp === null) notes.push('Maximum TRP/EIRP for this class are not in the reference notes and are not checked.');
    const tail = 'Spherical coverage is verified at normal temperature only.';
    const name = `3gpp-fr2-pc${pc}-${band}`;
    const hasIa = INITIAL_ACCESS.includes(Number(pc));
    const mb = MB[pc]?.[band];
    const variants = [hasIa ? `${name}-initial-access` : null, mb ? `${name}-multiband` : null].filter(Boolean);
    write(name, [`3GPP FR2 UE power class ${pc} (${CLASS_NAMES[pc]}), band ${band}: transmit limits.`], {
      name,
      description: [...notes,
        ...(variants.length ? [`Connected-mode, single-band values; variants: ${variants.join(', ')}.`] : []), tail].join(' '),
      source: `${clause}; ${VERIFY}`,
      quantity: 'eirp',
      band,
      frequency_range_mhz: BANDS[band],
      checks: [peakCheck(minPeak), coverageCheck(sph), ...maxChecks],
    });
    if (hasIa) {
      // Initial access / RRC_INACTIVE: coverage minimum − 2 dB, minimum peak EIRP does not apply.
      write(`${name}-initial-access`, [`3GPP FR2 UE power class ${pc} (${CLASS_NAMES[pc]}), band ${band}: transmit limits in initial access and RRC_INACTIVE.`], {
        name: `${name}-initial-access`,
        description: [...notes,
          `Initial access and RRC_INACTIVE variant: the spherical-coverage minimum is the ${txTable(pc, 3).split(' (')[0]} value (${sph} dBm) minus ${INITIAL_ACCESS_DB} dB, and the minimum peak EIRP does not apply (not checked).`,
          tail].join(' '),
        source: `${clause}; ${VERIFY}`,
        quantity: 'eirp',
        band,
        frequency_range_mhz: BANDS[band],
        checks: [coverageCheck(dec(sph - INITIAL_ACCESS_DB), `, minus ${INITIAL_ACCESS_DB} dB for initial access and RRC_INACTIVE (clause 6.2.1.${pc})`), ...maxChecks],
      });
    }
    if (mb) {
      const [dPeak, dCov] = mb;
      const mbTable = `Table 6.2.1.3-4${pc === '3' ? '' : `, as applied to power class ${pc}`}`;
      write(`${name}-multiband`, [`3GPP FR2 UE power class ${pc} (${CLASS_NAMES[pc]}), band ${band}: transmit limits for a UE supporting several FR2 bands.`], {
        name: `${name}-multiband`,
        description: [...notes,
          `Multi-band variant: minimum peak EIRP relaxed by ${dPeak} dB and spherical coverage by ${dCov} dB (${mbTable}).`,
          'Footnotes of the table set some relaxations to 0 dB for UEs supporting only n261+n260 or n261+n257: use the single-band profile then.',
          tail].join(' '),
        source: `${clause}; ${VERIFY}`,
        quantity: 'eirp',
        band,
        frequency_range_mhz: BANDS[band],
        checks: [
          peakCheck(dec(minPeak - dPeak), ` minus the ${dPeak} dB multi-band relaxation of ${mbTable}`),
          coverageCheck(dec(sph - dCov), ` minus the ${dCov} dB multi-band relaxation of ${mbTable}`),
          ...maxChecks,
        ],
      });
    }
  }
}

for (const [band, [refsens, sph]] of Object.entries(RX)) {
  BW.forEach((bw, i) => {
    const name = `3gpp-fr2-pc3-${band}-eis-${bw}mhz`;
    write(name, [`3GPP FR2 UE power class 3 (handheld), band ${band}, ${bw} MHz channel: receive (EIS) limits.`], {
      name,
      description: `Power class 3 (handheld) UE, band ${band}, ${bw} MHz channel bandwidth, receive. `
        + 'EIS: lower is better. REFSENS is judged as the best (lowest) EIS over the sphere ≤ REFSENS; '
        + 'EIS spherical coverage as the EIS at the 50 % level ≤ limit (the 50th percentile of the CCDF of EIS '
        + 'equals the 50 % CDF level: half of the sphere by solid angle has EIS at or below the value).',
      source: `${SPEC}, clauses 7.3.2 and 7.3.4; ${VERIFY}`,
      quantity: 'eis',
      band,
      frequency_range_mhz: BANDS[band],
      checks: [
        { kind: 'min-peak', name: 'REFSENS (peak EIS)', limit: refsens[i],
          source: `${SPEC}, clause 7.3.2, Table 7.3.2.3-1 (${bw} MHz); ${VERIFY}` },
        { kind: 'percentile', name: 'EIS spherical coverage (50 %-tile)', level_pct: 50, limit: sph[i],
          source: `${SPEC}, clause 7.3.4, Table 7.3.4.3-1 (${bw} MHz): maximum EIS at the 50 %-tile of the CCDF of EIS over the full sphere; ${VERIFY}` },
      ],
    });
  });
}

// Beam correspondence, PC3 (S1 §6.6.4, Table 6.6.4.2-1): 85th percentile of ΔEIRP_BC over the
// upper 50 % of EIRP2 ≤ 3.0 dB (n257, n258, n261) or 3.2 dB (n259, n260, n262).
const BC = { n257: 3.0, n258: 3.0, n261: 3.0, n259: 3.2, n260: 3.2, n262: 3.2 };
for (const [band, maxDb] of Object.entries(BC)) {
  const name = `3gpp-fr2-pc3-${band}-beam-correspondence`;
  write(name, [`3GPP FR2 UE power class 3 (handheld), band ${band}: beam correspondence.`], {
    name,
    description: `Power class 3 (handheld) UE, band ${band}, beam correspondence. ΔEIRP_BC = EIRP2 − EIRP1 per direction, `
      + 'EIRP2 the best EIRP over the codebook (the total scan pattern), EIRP1 the EIRP of the beam chosen from the receive (EIS) '
      + 'measurement; over the directions in the upper 50 % of EIRP2 by solid angle, the 85th percentile must not exceed the limit. '
      + 'Needs the unit\'s EIRP and EIS exports of the same codebook at the same frequency (same unit, same beam ids). '
      + 'Combine with the transmit profile in a job file (limits + checks) to judge both.',
    source: `${SPEC}, clause 6.6.4; ${VERIFY}`,
    quantity: 'eirp',
    band,
    frequency_range_mhz: BANDS[band],
    checks: [
      { kind: 'beam-correspondence', name: 'beam correspondence ΔEIRP_BC (85 %-tile)', limit: maxDb, level_pct: 85, top_share_pct: 50,
        source: `${SPEC}, clause 6.6.4, Table 6.6.4.2-1: 85th percentile of ΔEIRP_BC over the upper 50 % of EIRP2 ≤ ${maxDb.toFixed(1)} dB; ${VERIFY}` },
    ],
  });
}

// Inter-band UL CA, PC3 (S1 §6.2A.1): per band the region where EIRP ≥ its Table 6.2.1.3-3 level
// − ΔT_IB,S,n (6.0 dB for CA_n257A-n259A and CA_n260A-n261A); the share of 4π where both hold
// must be at least (100 − 50) %.
for (const [a, b] of [['n257', 'n259'], ['n260', 'n261']]) {
  const name = `3gpp-fr2-pc3-ca-${a}-${b}`;
  const bandOf = (x) => ({ name: x, frequency_range_mhz: BANDS[x], limit: TX[3][1][x][3] });
  write(name, [`3GPP FR2 UE power class 3 (handheld), inter-band CA_${a}A-${b}A: joint spherical coverage.`], {
    name,
    description: `Power class 3 (handheld) UE, inter-band uplink CA_${a}A-${b}A. Per band the region where EIRP ≥ that band's `
      + 'spherical-coverage level (Table 6.2.1.3-3) − ΔT_IB,S,n = 6.0 dB; the share of the full sphere where both regions hold must be '
      + 'at least 50 %. Needs the unit measured in both bands (the same unit, two frequencies).',
    source: `${SPEC}, clause 6.2A.1; ${VERIFY}`,
    quantity: 'eirp',
    frequency_range_mhz: [BANDS[a][0], Math.max(BANDS[a][1], BANDS[b][1])].sort((x, y) => x - y),
    checks: [
      { kind: 'inter-band-coverage', name: `inter-band coverage CA_${a}A-${b}A`, level_pct: 50, delta_db: 6.0, bands: [bandOf(a), bandOf(b)],
        source: `${SPEC}, clause 6.2A.1 (ΔT_IB,S,n = 6.0 dB for CA_${a}A-${b}A, PC3; levels from Table 6.2.1.3-3); ${VERIFY}` },
    ],
  });
}
