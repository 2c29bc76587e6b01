import { describe, expect, it } from 'vitest';
import { handbookSteels } from '@loopwise/material';
import { trackNotch } from '@loopwise/notch';

// The README example, executed so the documentation cannot drift from the code.
describe('README example', () => {
  it('SAE 1045, Kt 2.5: 0, 300, -240, 360 closes one loop', () => {
    const material = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;
    const result = trackNotch([0, 300, -240, 360], { material, Kt: 2.5 });
    expect(result.loops.length).toBe(1);
    expect(result.loops.row(0)).toMatchObject({ startIndex: 1, turnIndex: 2, closeIndex: 3 });
  });
});
