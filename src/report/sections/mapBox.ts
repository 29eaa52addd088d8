import type { MapBox } from '../drawMap.js';
import { contentWidth, MARGIN, type Doc } from '../pdfDoc.js';

/** The box of a full-width map below the cursor (2:1, room for the colour bar on the right). */
export function mapBoxFor(doc: Doc, height: number): MapBox {
  const mapW = Math.min(contentWidth(doc) - 95, 2 * height);
  return { x: MARGIN.left + 34, y: doc.y + 12, w: mapW, h: mapW / 2 };
}

/**
 * A label's y moved clear of the φ labels that sit just below the equator (drawMapFrame puts them
 * 6 pt under it): within 9 pt of that row it goes 9 pt above or below.
 */
export function clearOfPhiLabels(box: MapBox, y: number): number {
  const row = box.y + box.h / 2 + 6;
  return Math.abs(y - row) < 9 ? (y < row ? row - 9 : row + 9) : y;
}
