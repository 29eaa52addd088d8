/** A rectangle on a PDF page, in points from the top-left corner: plots, maps and axes frames. */
export interface PageBox {
  x: number;
  y: number;
  w: number;
  h: number;
}
