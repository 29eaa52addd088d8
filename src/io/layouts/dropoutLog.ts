/** Most dropout locations quoted in the warning; the rest are counted. */
const SHOWN = 5;

/**
 * Dropout cells of one file (job file `dropout_tokens`: `OVLD`, `NaN`, `--`, an empty cell …)
 * read as missing samples: how many, and where the first few were (line, column, direction),
 * for the 'dropout-samples' warning. O(1) a cell.
 */
export class DropoutLog {
  count = 0;
  firstLine = 0;
  readonly shown: string[] = [];

  add(line: number, column: string, thetaDeg: number, phiDeg: number): void {
    if (this.count === 0) this.firstLine = line;
    this.count++;
    if (this.shown.length < SHOWN) this.shown.push(`line ${line} '${column}' (θ ${round(thetaDeg)}°, φ ${round(phiDeg)}°)`);
  }
}

const round = (x: number): number => Math.round(x * 1e6) / 1e6;
