// A consumer of the published typings, compiled by tsc with strict settings and skipLibCheck false
// in a fresh project (test/consumer/consumer.test.ts).
import { analyzeBeams, BeamsInputError, unitReportPdf, type BeamsInput, type UnitAnalysis, type UnitResult } from 'spherecov';

const thetaDeg: number[] = [];
const phiDeg: number[] = [];
for (let t = 0; t <= 180; t += 15) for (let p = 0; p < 360; p += 15) [thetaDeg.push(t), phiDeg.push(p)];
const input: BeamsInput = {
  unit: 'EX-1',
  frequencyHz: 28e9,
  directions: { thetaDeg, phiDeg },
  beams: [{ id: '0', values: thetaDeg.map((t) => 20 * Math.cos((t * Math.PI) / 360)) }],
  limits: '3gpp-fr2-pc3-n257',
};
export async function run(): Promise<{ verdict: UnitResult['verdict']; bytes: number }> {
  let analysis: UnitAnalysis;
  try {
    analysis = analyzeBeams(input);
  } catch (e) {
    if (e instanceof BeamsInputError) throw new Error(e.problems.join('\n'));
    throw e;
  }
  const pdf: Uint8Array = await unitReportPdf(analysis);
  return { verdict: analysis.result.verdict, bytes: pdf.length };
}
