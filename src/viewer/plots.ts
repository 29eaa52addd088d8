/// <reference lib="dom" />
/**
 * The page's two curves on canvases: the solid-angle-weighted CDF of the total scan pattern
 * (src/report/cdfCurve.ts, the PDF's curve) with the percentile limits, and the
 * coverage-efficiency curve (computeMetrics' curve) with the coverage limits. A pointer read-out
 * gives the value at the pointer's level (CDF) or the efficiency at the pointer's threshold.
 */
import { niceRange } from '../report/format.js';

export interface Series { x: ArrayLike<number>; y: ArrayLike<number>; color: string; width: number; step: boolean; label: string }
export interface Marker { x: number; y: number; label: string; pass: boolean | null }

export interface PlotSpec {
  xLabel: string;
  yLabel: string;
  series: Series[];
  markers: Marker[];
  /** Text for a pointer at data coordinates (x, y), or null. */
  readout: (x: number, y: number) => string | null;
  xRange?: [number, number];
}

const PAD = { left: 62, right: 14, top: 12, bottom: 38 };

export class Plot {
  private spec: PlotSpec | null = null;
  private x0 = 0; private x1 = 1;
  private pointer: [number, number] | null = null;

  constructor(readonly canvas: HTMLCanvasElement, private out: HTMLElement) {
    canvas.width = 560;
    canvas.height = 300;
    canvas.addEventListener('pointermove', (e) => {
      const r = canvas.getBoundingClientRect();
      this.pointer = [((e.clientX - r.left) / r.width) * canvas.width, ((e.clientY - r.top) / r.height) * canvas.height];
      this.draw();
    });
    canvas.addEventListener('pointerleave', () => { this.pointer = null; this.draw(); });
  }

  set(spec: PlotSpec): void {
    this.spec = spec;
    let lo = Infinity, hi = -Infinity;
    for (const s of spec.series) for (let i = 0; i < s.x.length; i++) { const v = s.x[i]; if (Number.isFinite(v)) { lo = Math.min(lo, v); hi = Math.max(hi, v); } }
    for (const m of spec.markers) { lo = Math.min(lo, m.x); hi = Math.max(hi, m.x); }
    if (spec.xRange) [lo, hi] = spec.xRange;
    if (!Number.isFinite(lo)) { lo = 0; hi = 1; }
    const pad = 0.03 * (hi - lo || 1); // a limit on the range's edge stays visible
    const r = niceRange(lo - pad, hi + pad, 7);
    this.x0 = r.lo; this.x1 = r.hi;
    this.draw();
  }

  /** Data → canvas pixels. */
  private px(x: number): number { return PAD.left + ((x - this.x0) / (this.x1 - this.x0)) * (this.canvas.width - PAD.left - PAD.right); }
  private py(y: number): number { return this.canvas.height - PAD.bottom - y * (this.canvas.height - PAD.top - PAD.bottom); }

  /** Client coordinates of data (x, y), for tests. */
  clientOf(x: number, y: number): [number, number] {
    const r = this.canvas.getBoundingClientRect();
    return [r.left + (this.px(x) / this.canvas.width) * r.width, r.top + (this.py(y) / this.canvas.height) * r.height];
  }

  draw(): void {
    const ctx = this.canvas.getContext('2d');
    const s = this.spec;
    if (!ctx || !s) return;
    const W = this.canvas.width, H = this.canvas.height;
    ctx.clearRect(0, 0, W, H);
    ctx.fillStyle = '#fff';
    ctx.fillRect(0, 0, W, H);
    ctx.font = '11px sans-serif';
    ctx.strokeStyle = '#ddd';
    ctx.fillStyle = '#333';
    ctx.lineWidth = 1;
    const xt = niceRange(this.x0, this.x1, 7);
    for (const t of xt.ticks) {
      ctx.beginPath(); ctx.moveTo(this.px(t), this.py(0)); ctx.lineTo(this.px(t), this.py(1)); ctx.stroke();
      ctx.fillText(String(+t.toFixed(2)), this.px(t) - 8, H - PAD.bottom + 14);
    }
    for (let k = 0; k <= 10; k += 2) {
      const y = k / 10;
      ctx.beginPath(); ctx.moveTo(this.px(this.x0), this.py(y)); ctx.lineTo(this.px(this.x1), this.py(y)); ctx.stroke();
      ctx.textAlign = 'right';
      ctx.fillText(`${k * 10} %`, PAD.left - 4, this.py(y) + 4);
      ctx.textAlign = 'left';
    }
    ctx.fillText(s.xLabel, W / 2 - 40, H - 6);
    ctx.save();
    ctx.translate(12, H / 2 + 30); ctx.rotate(-Math.PI / 2); ctx.fillText(s.yLabel, 0, 0);
    ctx.restore();
    ctx.save();
    ctx.beginPath(); ctx.rect(PAD.left, PAD.top, W - PAD.left - PAD.right, H - PAD.top - PAD.bottom); ctx.clip();
    for (const ser of s.series) {
      ctx.strokeStyle = ser.color;
      ctx.lineWidth = ser.width;
      ctx.beginPath();
      let started = false, prevY = 0;
      for (let i = 0; i < ser.x.length; i++) {
        const X = this.px(ser.x[i]), Y = this.py(ser.y[i]);
        if (!started) { ctx.moveTo(X, Y); started = true; }
        else if (ser.step) { ctx.lineTo(X, prevY); ctx.lineTo(X, Y); }
        else ctx.lineTo(X, Y);
        prevY = Y;
      }
      ctx.stroke();
    }
    for (const m of s.markers) {
      const X = this.px(m.x), Y = this.py(m.y);
      ctx.strokeStyle = m.pass === false ? '#b00020' : '#1a1a1a';
      ctx.lineWidth = 1.5;
      ctx.setLineDash([4, 3]);
      ctx.beginPath(); ctx.moveTo(X, this.py(0)); ctx.lineTo(X, this.py(1)); ctx.stroke();
      ctx.setLineDash([]);
      ctx.beginPath(); ctx.moveTo(X - 6, Y); ctx.lineTo(X + 6, Y); ctx.moveTo(X, Y - 6); ctx.lineTo(X, Y + 6); ctx.stroke();
      ctx.fillStyle = ctx.strokeStyle;
      const right = X + 8 + ctx.measureText(m.label).width < W - PAD.right;
      ctx.textAlign = right ? 'left' : 'right';
      ctx.fillText(m.label, right ? X + 4 : X - 4, Y - 6);
      ctx.textAlign = 'left';
    }
    ctx.restore();
    let text: string | null = null;
    if (this.pointer) {
      const [X, Y] = this.pointer;
      const x = this.x0 + ((X - PAD.left) / (W - PAD.left - PAD.right)) * (this.x1 - this.x0);
      const y = (H - PAD.bottom - Y) / (H - PAD.top - PAD.bottom);
      if (y >= 0 && y <= 1 && x >= this.x0 && x <= this.x1) {
        text = s.readout(x, y);
        ctx.strokeStyle = 'rgba(0,0,0,0.4)';
        ctx.beginPath(); ctx.moveTo(X, this.py(0)); ctx.lineTo(X, this.py(1)); ctx.moveTo(this.px(this.x0), Y); ctx.lineTo(this.px(this.x1), Y); ctx.stroke();
      }
    }
    this.out.textContent = text ?? 'Point at the plot for a read-out.';
  }
}
