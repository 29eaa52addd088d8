/// <reference lib="dom" />
/**
 * The unit's pattern on a rotatable sphere (three.js, bundled into the page). Directions use the
 * tool's convention: θ from +z, φ from +x toward +y; the camera's up vector is +z. Mouse: drag to
 * turn, wheel to zoom; keyboard (canvas focused): arrows turn by 10°, + and − zoom, 0 resets.
 */
import {
  AxesHelper, BufferAttribute, BufferGeometry, Mesh, MeshBasicMaterial, PerspectiveCamera, Raycaster, Scene,
  SphereGeometry, Vector2, Vector3, WebGLRenderer,
} from 'three';
import { OrbitControls } from 'three/examples/jsm/controls/OrbitControls.js';
import type { NearestLookup } from '../report/nearestGridPoint.js';
import { unitVector } from '../sphere/direction.js';

const STEP_DEG = 2;
const RAD = Math.PI / 180;

export function webglAvailable(): boolean {
  try {
    const c = document.createElement('canvas');
    return !!(c.getContext('webgl2') ?? c.getContext('webgl'));
  } catch {
    return false;
  }
}

const unitVector3 = (thetaDeg: number, phiDeg: number): Vector3 => new Vector3(...unitVector(thetaDeg, phiDeg));

export class SphereView {
  private renderer: WebGLRenderer;
  private scene = new Scene();
  private camera = new PerspectiveCamera(35, 1, 0.1, 50);
  private controls: OrbitControls;
  private geometry: BufferGeometry;
  private mesh: Mesh;
  private marker: Mesh;
  private vertexPoint: Int32Array;

  constructor(readonly canvas: HTMLCanvasElement, private onPoint: (dir: { thetaDeg: number; phiDeg: number } | null) => void) {
    this.renderer = new WebGLRenderer({ canvas, antialias: true, preserveDrawingBuffer: true });
    this.renderer.setClearColor(0xffffff, 1);
    this.camera.up.set(0, 0, 1);
    this.resetView();
    const rings = 180 / STEP_DEG + 1, cols = 360 / STEP_DEG + 1;
    const pos = new Float32Array(rings * cols * 3);
    for (let r = 0; r < rings; r++) for (let c = 0; c < cols; c++) pos.set(unitVector3(r * STEP_DEG, c * STEP_DEG).toArray(), 3 * (r * cols + c));
    const index: number[] = [];
    for (let r = 0; r + 1 < rings; r++) for (let c = 0; c + 1 < cols; c++) {
      const a = r * cols + c, b = a + 1, d = a + cols, e = d + 1;
      index.push(a, d, b, b, d, e);
    }
    this.geometry = new BufferGeometry();
    this.geometry.setAttribute('position', new BufferAttribute(pos, 3));
    this.geometry.setAttribute('color', new BufferAttribute(new Float32Array(rings * cols * 3), 3));
    this.geometry.setIndex(index);
    this.vertexPoint = new Int32Array(rings * cols).fill(-1);
    this.mesh = new Mesh(this.geometry, new MeshBasicMaterial({ vertexColors: true }));
    this.scene.add(this.mesh);
    this.scene.add(new AxesHelper(1.45));
    this.marker = new Mesh(new SphereGeometry(0.03, 12, 8), new MeshBasicMaterial({ color: 0x000000 }));
    this.marker.visible = false;
    this.scene.add(this.marker);
    this.controls = new OrbitControls(this.camera, canvas);
    this.controls.enablePan = false;
    this.controls.minDistance = 1.6;
    this.controls.maxDistance = 10;
    this.controls.addEventListener('change', () => this.render());
    canvas.tabIndex = 0;
    canvas.addEventListener('keydown', (e) => this.onKey(e));
    canvas.addEventListener('pointermove', (e) => this.onPoint(this.directionAt(e.clientX, e.clientY)));
    canvas.addEventListener('pointerleave', () => this.onPoint(null));
    this.resize();
  }

  resetView(): void {
    this.camera.position.copy(unitVector3(60, 30).multiplyScalar(4.2));
    this.camera.lookAt(0, 0, 0);
  }

  resize(): void {
    const w = this.canvas.clientWidth || 400, h = this.canvas.clientHeight || 400;
    this.renderer.setPixelRatio(window.devicePixelRatio || 1);
    this.renderer.setSize(w, h, false);
    this.camera.aspect = w / h;
    this.camera.updateProjectionMatrix();
    this.render();
  }

  /** Which grid point each vertex shows (the map's lookup: the cell that holds the direction). */
  setGrid(lookup: NearestLookup): void {
    const rings = 180 / STEP_DEG + 1, cols = 360 / STEP_DEG + 1;
    for (let r = 0; r < rings; r++) for (let c = 0; c < cols; c++) this.vertexPoint[r * cols + c] = lookup(r * STEP_DEG, (c * STEP_DEG) % 360);
  }

  /** Colour the vertices from per-grid-point RGBA (unmeasured: light grey). */
  paint(colors: Uint8ClampedArray): void {
    const attr = this.geometry.getAttribute('color') as BufferAttribute;
    const arr = attr.array as Float32Array;
    for (let v = 0; v < this.vertexPoint.length; v++) {
      const p = this.vertexPoint[v];
      const ok = p >= 0 && colors[4 * p + 3] > 0;
      // Vertex colours are linear in three.js's colour management: decode the sRGB bytes.
      for (let k = 0; k < 3; k++) arr[3 * v + k] = srgbToLinear(ok ? colors[4 * p + k] / 255 : 0.85);
    }
    attr.needsUpdate = true;
    this.render();
  }

  setMarker(dir: { thetaDeg: number; phiDeg: number } | null): void {
    this.marker.visible = dir !== null;
    if (dir) this.marker.position.copy(unitVector3(dir.thetaDeg, dir.phiDeg).multiplyScalar(1.01));
    this.render();
  }

  directionAt(clientX: number, clientY: number): { thetaDeg: number; phiDeg: number } | null {
    const rect = this.canvas.getBoundingClientRect();
    const ndc = new Vector2(((clientX - rect.left) / rect.width) * 2 - 1, -((clientY - rect.top) / rect.height) * 2 + 1);
    const ray = new Raycaster();
    ray.setFromCamera(ndc, this.camera);
    const hit = ray.intersectObject(this.mesh, false)[0];
    if (!hit) return null;
    const p = hit.point.clone().normalize();
    let phiDeg = Math.atan2(p.y, p.x) / RAD;
    if (phiDeg < 0) phiDeg += 360;
    return { thetaDeg: Math.acos(Math.max(-1, Math.min(1, p.z))) / RAD, phiDeg };
  }

  /** Client coordinates of a direction when it faces the camera, else null (for tests and the cursor). */
  clientOf(thetaDeg: number, phiDeg: number): [number, number] | null {
    const u = unitVector3(thetaDeg, phiDeg);
    if (u.dot(this.camera.position.clone().normalize()) < 0.2) return null;
    const ndc = u.clone().project(this.camera);
    const rect = this.canvas.getBoundingClientRect();
    return [rect.left + ((ndc.x + 1) / 2) * rect.width, rect.top + ((1 - ndc.y) / 2) * rect.height];
  }

  /** Turn the camera to look at a direction from outside. */
  face(thetaDeg: number, phiDeg: number): void {
    const d = this.camera.position.length();
    this.camera.position.copy(unitVector3(Math.min(179, Math.max(1, thetaDeg)), phiDeg).multiplyScalar(d));
    this.camera.lookAt(0, 0, 0);
    this.controls.update();
    this.render();
  }

  private onKey(e: KeyboardEvent): void {
    // The camera's direction in the tool's own frame: θ from +z, φ from +x.
    const p = this.camera.position;
    const r = p.length();
    let th = Math.acos(p.z / r) / RAD, ph = Math.atan2(p.y, p.x) / RAD;
    let dist = r;
    if (e.key === 'ArrowLeft') ph -= 10;
    else if (e.key === 'ArrowRight') ph += 10;
    else if (e.key === 'ArrowUp') th -= 10;
    else if (e.key === 'ArrowDown') th += 10;
    else if (e.key === '+' || e.key === '=') dist = Math.max(1.6, r / 1.15);
    else if (e.key === '-') dist = Math.min(10, r * 1.15);
    else if (e.key === '0') { this.resetView(); this.controls.update(); this.render(); e.preventDefault(); return; }
    else return;
    e.preventDefault();
    th = Math.min(179, Math.max(1, th));
    this.camera.position.copy(unitVector3(th, ph).multiplyScalar(dist));
    this.camera.lookAt(0, 0, 0);
    this.controls.update();
    this.render();
  }

  render(): void {
    this.renderer.render(this.scene, this.camera);
  }
}

function srgbToLinear(c: number): number {
  return c <= 0.04045 ? c / 12.92 : Math.pow((c + 0.055) / 1.055, 2.4);
}
