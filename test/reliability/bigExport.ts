/**
 * A large long-layout export written in chunks (never the whole text in memory): `beams` beams
 * on a regular θ/φ grid of `stepDeg`, values with two decimals from a smooth invented lobe.
 */
import { createWriteStream } from 'node:fs';

/** `noteChars` > 0 adds an ignored text column of that width, so the text outweighs the numbers. */
export async function writeBigExport(file: string, beams: number, stepDeg: number, noteChars = 0): Promise<{ rows: number; bytes: number }> {
  const nth = Math.round(180 / stepDeg) + 1;
  const nph = Math.round(360 / stepDeg);
  const ws = createWriteStream(file);
  let bytes = 0;
  const put = (s: string) => {
    bytes += s.length;
    return ws.write(s) ? Promise.resolve() : new Promise<void>((r) => ws.once('drain', () => r()));
  };
  const note = noteChars > 0 ? ',' + 'n'.repeat(noteChars) : '';
  await put(`theta_deg,phi_deg,beam,eirp_dbm${noteChars > 0 ? ',operator_note' : ''}\n`);
  const phiText = Array.from({ length: nph }, (_, j) => String(+(j * stepDeg).toFixed(4)));
  for (let b = 0; b < beams; b++) {
    const t0 = 20 + (140 * (b % 8)) / 7;
    const p0 = (360 * Math.floor(b / 8)) / Math.max(1, Math.ceil(beams / 8));
    for (let i = 0; i < nth; i++) {
      const t = +(i * stepDeg).toFixed(4);
      let chunk = '';
      for (let j = 0; j < nph; j++) {
        const dp = Math.min(Math.abs(j * stepDeg - p0), 360 - Math.abs(j * stepDeg - p0));
        const v = 25 - 0.004 * ((t - t0) ** 2 + dp * dp);
        chunk += `${t},${phiText[j]},${b},${Math.max(v, -20).toFixed(2)}${note}\n`;
      }
      await put(chunk);
    }
  }
  await new Promise<void>((r) => ws.end(() => r()));
  return { rows: beams * nth * nph, bytes };
}
