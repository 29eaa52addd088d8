/// <reference lib="dom" />
/**
 * The equal-area map of the page: the PDF's Hammer projection and rasterization
 * (src/report/hammerProjection.ts, src/report/mapRaster.ts), painted into a canvas, with a
 * graticule, a cursor and a pointer read-out callback.
 */
import type { SphereGrid } from '../types.js';
import { rasterizeGrid, OUTSIDE, type MapRaster } from '../report/mapRaster.js';
import { hammerForward, hammerInverse, HAMMER_HALF_HEIGHT, HAMMER_HALF_WIDTH } from '../report/hammerProjection.js';

/** The PDF maps' hatching of unmeasured directions (src/report/paintMap.ts; that module also encodes PNGs with node:zlib, so its constant is repeated here). */
const HATCH_PERIOD_PX = 7;

export const MAP_WIDTH_PX = 720;

export class MapView {
  readonly canvas: HTMLCanvasElement;
  private raster: MapRaster | null = null;
  private image: ImageData | null = null;
  private cursor: { thetaDeg: number; phiDeg: number } | null = null;
  private hover: { thetaDeg: number; phiDeg: number } | null = null;
  centerPhiDeg = 0;

  constructor(canvas: HTMLCanvasElement, private onPoint: (dir: { thetaDeg: number; phiDeg: number } | null) => void) {
    this.canvas = canvas;
    canvas.width = MAP_WIDTH_PX;
    canvas.height = MAP_WIDTH_PX / 2;
    canvas.addEventListener('pointermove', (e) => this.onPoint(this.directionAt(e.clientX, e.clientY)));
    canvas.addEventListener('pointerleave', () => this.onPoint(null));
    canvas.addEventListener('click', (e) => {
      const d = this.directionAt(e.clientX, e.clientY);
      if (d) this.setCursor(d, true);
    });
  }

  setGrid(grid: SphereGrid, centerPhiDeg: number): void {
    this.centerPhiDeg = centerPhiDeg;
    this.raster = rasterizeGrid(grid, MAP_WIDTH_PX, centerPhiDeg);
  }

  /** Paint per-point colours (RGBA per grid point); unmeasured pixels hatched, outside clear. */
  paint(colors: Uint8ClampedArray): void {
    const r = this.raster;
    if (!r) return;
    const img = new ImageData(r.width, r.height);
    const d = img.data;
    for (let k = 0; k < r.point.length; k++) {
      const p = r.point[k];
      if (p === OUTSIDE) continue;
      if (p < 0 || colors[4 * p + 3] === 0) {
        const i = k % r.width, j = (k - i) / r.width;
        const stripe = (i + j) % HATCH_PERIOD_PX < 2;
        d[4 * k] = d[4 * k + 1] = d[4 * k + 2] = stripe ? 150 : 235;
        d[4 * k + 3] = 255;
        continue;
      }
      d[4 * k] = colors[4 * p]; d[4 * k + 1] = colors[4 * p + 1]; d[4 * k + 2] = colors[4 * p + 2]; d[4 * k + 3] = 255;
    }
    this.image = img;
    this.redraw();
  }

  /** Canvas pixel of a direction (for the cursor and for tests). */
  pixelOf(thetaDeg: number, phiDeg: number): [number, number] {
    const [x, y] = hammerForward(thetaDeg, phiDeg, this.centerPhiDeg);
    const w = this.canvas.width, h = this.canvas.height;
    return [((x + HAMMER_HALF_WIDTH) / (2 * HAMMER_HALF_WIDTH)) * w, ((HAMMER_HALF_HEIGHT - y) / (2 * HAMMER_HALF_HEIGHT)) * h];
  }

  /** Client (page) coordinates of a direction, for pointer events. */
  clientOf(thetaDeg: number, phiDeg: number): [number, number] {
    const [px, py] = this.pixelOf(thetaDeg, phiDeg);
    const rect = this.canvas.getBoundingClientRect();
    return [rect.left + (px / this.canvas.width) * rect.width, rect.top + (py / this.canvas.height) * rect.height];
  }

  directionAt(clientX: number, clientY: number): { thetaDeg: number; phiDeg: number } | null {
    const rect = this.canvas.getBoundingClientRect();
    const u = (clientX - rect.left) / rect.width, v = (clientY - rect.top) / rect.height;
    return hammerInverse(u * 2 * HAMMER_HALF_WIDTH - HAMMER_HALF_WIDTH, HAMMER_HALF_HEIGHT - v * 2 * HAMMER_HALF_HEIGHT, this.centerPhiDeg);
  }

  setCursor(dir: { thetaDeg: number; phiDeg: number } | null, notify = false): void {
    this.cursor = dir;
    this.redraw();
    if (notify) this.onPoint(dir);
  }

  /** The direction shown in the read-out (from the map, the sphere or the keyboard), marked with a cross. */
  setHover(dir: { thetaDeg: number; phiDeg: number } | null): void {
    this.hover = dir;
    this.redraw();
  }

  getCursor(): { thetaDeg: number; phiDeg: number } | null {
    return this.cursor;
  }

  private redraw(): void {
    const ctx = this.canvas.getContext('2d');
    if (!ctx) return;
    ctx.clearRect(0, 0, this.canvas.width, this.canvas.height);
    if (this.image) ctx.putImageData(this.image, 0, 0);
    ctx.save();
    ctx.strokeStyle = 'rgba(40,40,40,0.35)';
    ctx.lineWidth = 0.7;
    const line = (pts: [number, number][]) => {
      ctx.beginPath();
      pts.forEach(([a, b], k) => (k === 0 ? ctx.moveTo(a, b) : ctx.lineTo(a, b)));
      ctx.stroke();
    };
    for (let t = 30; t < 180; t += 30) line(Array.from({ length: 121 }, (_, k) => this.pixelOf(t, this.centerPhiDeg - 180 + 0.001 + k * (359.998 / 120))));
    for (let lon = -150; lon <= 180; lon += 30) {
      const phi = this.centerPhiDeg + (lon === 180 ? 179.999 : lon);
      line(Array.from({ length: 61 }, (_, k) => this.pixelOf(k * 3, phi)));
    }
    ctx.fillStyle = '#333';
    ctx.font = '11px sans-serif';
    for (let lon = -120; lon <= 120; lon += 60) {
      const phi = (((this.centerPhiDeg + lon) % 360) + 360) % 360;
      const [x, y] = this.pixelOf(90, phi);
      ctx.fillText(`φ ${phi}°`, x + 3, y - 3);
    }
    for (const t of [30, 60, 120, 150]) {
      const [x, y] = this.pixelOf(t, this.centerPhiDeg);
      ctx.fillText(`θ ${t}°`, x + 3, y - 3);
    }
    if (this.cursor) {
      const [x, y] = this.pixelOf(this.cursor.thetaDeg, this.cursor.phiDeg);
      ctx.strokeStyle = '#000';
      ctx.lineWidth = 2;
      ctx.beginPath(); ctx.arc(x, y, 6, 0, 2 * Math.PI); ctx.stroke();
      ctx.strokeStyle = '#fff';
      ctx.lineWidth = 1;
      ctx.beginPath(); ctx.arc(x, y, 8, 0, 2 * Math.PI); ctx.stroke();
    }
    if (this.hover) {
      const [x, y] = this.pixelOf(this.hover.thetaDeg, this.hover.phiDeg);
      for (const [color, width] of [['#fff', 3.5], ['#000', 1.5]] as const) {
        ctx.strokeStyle = color;
        ctx.lineWidth = width;
        ctx.beginPath(); ctx.moveTo(x - 9, y); ctx.lineTo(x - 3, y); ctx.moveTo(x + 3, y); ctx.lineTo(x + 9, y);
        ctx.moveTo(x, y - 9); ctx.lineTo(x, y - 3); ctx.moveTo(x, y + 3); ctx.lineTo(x, y + 9); ctx.stroke();
      }
    }
    ctx.restore();
  }
}
