import { describe, expect, it } from 'vitest';
import { handbookSteels } from '@loopwise/material';
import { turningPoints } from '@loopwise/rainflow';
import { NotchTracker, trackNotch } from '@loopwise/notch';

// The README examples, executed so the documentation cannot drift from the code (the ```js
// block also runs in test/readme-examples.test.ts at the repository root).
describe('README example', () => {
  const material = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;

  it('SAE 1045, Kt 2.5: 0, 300, -240, 360 closes one loop', () => {
    const result = trackNotch([0, 300, -240, 360], { material, Kt: 2.5 });
    expect(result.loops.length).toBe(1);
    expect(result.loops.row(0)).toMatchObject({ startIndex: 1, turnIndex: 2, closeIndex: 3 });
  });

  it('tracker.pushIndexed(values, indices, from, to) on turning points keeps their indices', () => {
    const tp = turningPoints([0, 300, -240, 320, 360, 200]);
    expect(Array.from(tp.indices)).toEqual([0, 1, 2, 4, 5]);
    const tracker = new NotchTracker({ material, Kt: 2.5 }).pushIndexed(tp.values, tp.indices, 0, tp.values.length);
    expect(tracker.end().loops.row(0)).toMatchObject({ startIndex: 1, turnIndex: 2, closeIndex: 4 });
    expect(trackNotch([0, 300, -240, 320, 360, 200], { material, Kt: 2.5 }).loops.row(0).closeIndex).toBe(3);
    expect(tracker.nextIndex).toBe(6);
  });
});
