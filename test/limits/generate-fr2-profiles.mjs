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
    'Test tolerance is 0 dB in every check: add your own agreed values (toleranceDb) per check.',
  ].map((l) => `# ${l}`).join('\n') + '\n';
}

function write(name, headLines, body) {
  const doc = new Document(body);
  doc.get('frequencyRangeMHz', true).flow = true;
  writeFileSync(`${OUT}${name}.yaml`, header(headLines) + doc.toString({ lineWidth: 100, minContentWidth: 40 }));
}

for (const f of readdirSync(OUT)) if (f.startsWith('3gpp-fr2-') && f.endsWith('.yaml')) unlinkSync(`${OUT}${f}`);

for (const [pc, [pct, bands]] of Object.entries(TX)) {
  for (const [band, [minPeak, maxTrp, maxEirp, sph]] of Object.entries(bands)) {
    const clause = `${SPEC}, clause 6.2.1.${pc}`;
    const checks = [
      { kind: 'min-peak', name: 'minimum peak EIRP', limit: minPeak,
        source: `${clause}, Table 6.2.1.${pc}-1 (table number from memory); ${VERIFY}` },
      { kind: 'percentile', name: `spherical coverage EIRP (${pct} %-tile)`, levelPct: pct, limit: sph,
        source: `${clause}, Table 6.2.1.${pc}-3 (table number from memory): minimum EIRP at the ${pct} %-tile of the CDF of total EIRP over the full sphere; ${VERIFY}` },
    ];
    if (maxTrp !== null) {
      checks.push(
        { kind: 'max-trp', name: 'maximum TRP', limit: maxTrp,
          source: `${clause}, Table 6.2.1.${pc}-2 (table number from memory); ${VERIFY}` },
        { kind: 'max-peak', name: 'maximum EIRP', limit: maxEirp,
          source: `${clause}, Table 6.2.1.${pc}-2 (table number from memory); ${VERIFY}` });
    }
    const notes = [
      `Power class ${pc} (${CLASS_NAMES[pc]}) UE, band ${band}, transmit.`,
      `Spherical coverage: the EIRP at the ${pct} % CDF level must reach the limit, i.e. at least ${100 - pct} % of the sphere by solid angle reaches it.`,
    ];
    if (maxTrp === null) notes.push('Maximum TRP/EIRP for this class are not in the reference notes and are not checked.');
    if ([1, 3, 5, 7].includes(Number(pc))) notes.push('Not applied: the 2 dB lower spherical-coverage minimum for initial access and RRC_INACTIVE.');
    if (pc === '3') notes.push('Not applied: the multi-band relaxations of Table 6.2.1.3-4 (add them as toleranceDb or a programme check if your UE supports several FR2 bands).');
    notes.push('Spherical coverage is verified at normal temperature only.');
    const name = `3gpp-fr2-pc${pc}-${band}`;
    write(name, [`3GPP FR2 UE power class ${pc} (${CLASS_NAMES[pc]}), band ${band}: transmit limits.`], {
      name,
      description: notes.join(' '),
      source: `${clause}; ${VERIFY}`,
      quantity: 'eirp',
      band,
      frequencyRangeMHz: BANDS[band],
      checks,
    });
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
      frequencyRangeMHz: BANDS[band],
      checks: [
        { kind: 'min-peak', name: 'REFSENS (peak EIS)', limit: refsens[i],
          source: `${SPEC}, clause 7.3.2, Table 7.3.2.3-1 (${bw} MHz); ${VERIFY}` },
        { kind: 'percentile', name: 'EIS spherical coverage (50 %-tile)', levelPct: 50, limit: sph[i],
          source: `${SPEC}, clause 7.3.4, Table 7.3.4.3-1 (${bw} MHz): maximum EIS at the 50 %-tile of the CCDF of EIS over the full sphere; ${VERIFY}` },
      ],
    });
  });
}
