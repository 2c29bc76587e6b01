export interface Point {
  value: number;
  index: number;
}

export interface RefCycle {
  from: number;
  to: number;
  count: number;
  startIndex: number;
  turnIndex: number;
}

/** Peaks and valleys, ASTM E1049-85 3.1 (literal). */
export function referenceTurningPoints(history: ArrayLike<number>): Point[];
/** ASTM E1049-85 5.4.4, steps 1-6 (literal). */
export function astmRainflow(points: Point[]): RefCycle[];
/** ASTM E1049-85 5.4.5, repeating histories (literal). */
export function astmRepeating(points: Point[]): RefCycle[];
