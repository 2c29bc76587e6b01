/** The drawing area of a plot inside its SVG: overall size and the margins kept for the axes. */
export interface PlotFrame {
  width: number;
  height: number;
  left: number;
  right: number;
  top: number;
  bottom: number;
}

/** The usual frame: 1100 × `height` user units (the page is laid out for 1200 px). */
export function plotFrame(height: number, left = 84, right = 24, top = 16, bottom = 52): PlotFrame {
  return { width: 1100, height, left, right, top, bottom };
}

/** Pixel x of the frame's left and right edges of the drawing area. */
export function innerX(f: PlotFrame): [number, number] {
  return [f.left, f.width - f.right];
}

/** Pixel y of the bottom and top of the drawing area (bottom first: data grows upwards). */
export function innerY(f: PlotFrame): [number, number] {
  return [f.height - f.bottom, f.top];
}
