/**
 * The progress line on stderr: units done / total, current unit, elapsed, ETA. Drawn only on a
 * terminal and never with --quiet; redrawn in place with a carriage return.
 */

/** `m:ss` (or `h:mm:ss`) of a duration in seconds. */
export function clock(seconds: number): string {
  const s = Math.max(0, Math.round(seconds));
  const h = Math.floor(s / 3600), m = Math.floor((s % 3600) / 60), r = s % 60;
  const mm = h > 0 ? String(m).padStart(2, '0') : String(m);
  return `${h > 0 ? `${h}:` : ''}${mm}:${String(r).padStart(2, '0')}`;
}

/** The progress text; ETA from the mean time per finished item (unknown before the first). */
export function progressText(done: number, total: number, current: string, elapsedS: number): string {
  const eta = done > 0 ? clock((elapsedS / done) * (total - done)) : '–';
  return `[${done}/${total}] ${current}  elapsed ${clock(elapsedS)}  ETA ${eta}`;
}

export class Progress {
  private done = 0;
  private current = '';
  private readonly t0 = Date.now();
  private drawn = false;

  constructor(private readonly total: number, private readonly write: ((s: string) => void) | null) {}

  start(name: string): void {
    this.current = name;
    this.draw();
  }

  finish(): void {
    this.done++;
    this.draw();
  }

  get count(): number {
    return this.done;
  }

  /** Clear the line before other messages or at the end. */
  clear(): void {
    if (this.write && this.drawn) this.write('\r\x1b[2K');
    this.drawn = false;
  }

  private draw(): void {
    if (!this.write) return;
    const cols = process.stderr.columns || 100;
    const text = progressText(this.done, this.total, this.current, (Date.now() - this.t0) / 1000);
    this.write(`\r\x1b[2K${text.slice(0, cols - 1)}`);
    this.drawn = true;
  }
}
