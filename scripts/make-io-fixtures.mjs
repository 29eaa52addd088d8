// Writes the reader fixtures of the newer export shapes (fixtures/io/) from the reference
// long-layout files, keeping every value's text exactly as written there, so each fixture
// must read into the same Measurement as fixtures/io/long.csv. Run: node scripts/make-io-fixtures.mjs
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';

const IO = path.resolve('fixtures/io');
const rows = (file) => readFileSync(path.join(IO, file), 'utf8').split('\n').filter((l) => l && !l.startsWith('#')).slice(1).map((l) => l.split(','));
const total = rows('long.csv'); // theta,phi,beam,eirp,unit,freq
const pair = rows('long_pol_pair.csv'); // theta,phi,beam,a,b
/** direction key → { beam → cells } */
function byDirection(list, pick) {
  const m = new Map();
  for (const r of list) {
    const k = `${r[0]},${r[1]}`;
    if (!m.has(k)) m.set(k, new Map());
    m.get(k).set(r[2], pick(r));
  }
  return m;
}
const totals = byDirection(total, (r) => [r[3]]);
const pairs = byDirection(pair, (r) => [r[3], r[4]]);
const write = (name, lines) => {
  mkdirSync(path.dirname(path.join(IO, name)), { recursive: true });
  writeFileSync(path.join(IO, name), lines.join('\n') + '\n');
};
const wideRows = (m, sep = ',') => [...m].map(([k, beams]) => [k.replace(',', sep), ...beams.get('0'), ...beams.get('1')].join(sep));
const meta = ['# unit: DUT-A', '# frequency: 28 GHz'];

write('wide.csv', [...meta, 'Theta (deg),Phi (deg),Beam 0 EIRP (dBm),Beam 1 EIRP (dBm)', ...wideRows(totals)]);
write('wide_pair_co_cross.csv', [...meta, 'theta,phi,Beam 0 EIRP co (dBm),Beam 0 EIRP cross (dBm),Beam 1 EIRP co (dBm),Beam 1 EIRP cross (dBm)', ...wideRows(pairs)]);
write('wide_frequency_block.tsv', ['# unit: DUT-A', ['theta_deg', 'phi_deg', 'Beam 0 EIRP @ 28 GHz (dBm)', 'Beam 1 EIRP @ 28 GHz (dBm)'].join('\t'), ...wideRows(totals, '\t')]);
const longRows = (list) => list.map((r) => r.slice(0, 5).join(','));
write('preamble.csv', [
  'Pattern export of an invented test range', 'Unit: DUT-A', 'Operator: J. Doe (invented)', 'Frequency: 28 GHz', '',
  'theta_deg,phi_deg,beam,eirp_dbm', ...total.map((r) => r.slice(0, 4).join(',')),
]);
for (const [file, a, b] of [
  ['long_pair_co_cross.csv', 'eirp_co_dbm', 'eirp_cross_dbm'],
  ['long_pair_h_v.csv', 'EIRP H (dBm)', 'EIRP V (dBm)'],
  ['long_pair_lhcp_rhcp.csv', 'EIRP LHCP [dBm]', 'EIRP RHCP [dBm]'],
  ['long_pair_etheta_ephi.csv', 'Etheta (dBm)', 'Ephi (dBm)'],
]) write(file, [...meta, ...(file.includes('etheta') ? ['# quantity: eirp dBm'] : []), `theta,phi,beam,${a},${b}`, ...longRows(pair)]);
write('long_pol_column_h_v.csv', [...meta, 'theta,phi,beam,pol,eirp_dbm', ...pair.flatMap((r) => [[...r.slice(0, 3), 'H', r[3]].join(','), [...r.slice(0, 3), 'V', r[4]].join(',')])]);
const power = readFileSync(path.join(IO, 'calibrated/power.csv'), 'utf8');
write('calibrated_rx/rx_power.csv', [power.split('\n')[0].replace('power_dbm', 'Rx Power (dBm)'), ...power.trimEnd().split('\n').slice(1)]);
write('calibrated_rx/spherecov.yaml', [readFileSync(path.join(IO, 'calibrated/spherecov.yaml'), 'utf8').trimEnd()]);

// Dropout cells: the same data with a few value cells replaced by dropout tokens. Direction
// (θ 60, φ 90) is a dropout in both beams; (θ 120, φ 300) in beam 1 only. The equivalent long
// file is long.csv without those rows (test/io/dropouts.test.ts builds it).
const DROP = new Map([['60,90,0', 'OVLD'], ['60,90,1', 'NaN'], ['120,300,1', '--']]);
write('dropouts/long_dropouts.csv', [
  '# unit: DUT-A', '# frequency: 28 GHz', 'theta_deg,phi_deg,beam,eirp_dbm',
  ...total.map((r) => [r[0], r[1], r[2], DROP.get(`${r[0]},${r[1]},${r[2]}`) ?? r[3]].join(',')),
]);
write('dropouts/spherecov.yaml', ['# cells a chamber writes for a sample it could not take', "dropout_tokens: [OVLD, NaN, '--', '']"]);
const wideDrop = [...totals].map(([k, beams]) => {
  const [t, p] = k.split(',');
  const cell = (b) => (DROP.has(`${t},${p},${b}`) ? (b === '1' && t === '120' ? '' : DROP.get(`${t},${p},${b}`)) : beams.get(b)[0]);
  return [t, p, cell('0'), cell('1')].join(',');
});
write('dropouts/wide_dropouts.csv', ['# unit: DUT-B', '# frequency: 28 GHz', 'theta,phi,Beam 0 EIRP (dBm),Beam 1 EIRP (dBm)', ...wideDrop]);
