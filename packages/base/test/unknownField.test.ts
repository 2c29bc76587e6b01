import { describe, expect, it } from 'vitest';
import { nearestName, unknownField } from '@loopwise/base';

describe('nearestName(name, known) and unknownField(record, known, where)', () => {
  it("nearestName('kt', ['Kt', 'Kf', 'rule']) returns 'Kt' (a case-only difference is nearest of all)", () => {
    expect(nearestName('kt', ['Kt', 'Kf', 'rule'])).toBe('Kt');
    expect(nearestName('resdue', ['residue', 'gate'])).toBe('residue');
    expect(nearestName('zzzzzz', ['residue', 'gate'])).toBeUndefined();
  });

  it("unknownField({ kt: 2 }, ...) names the field, its value and the nearest known name", () => {
    expect(unknownField({ kt: 2 }, ['Kt', 'Kf', 'rule'], 'notch options')).toEqual({
      field: 'kt', value: 2, rule: "unknown field 'kt' in notch options; did you mean 'Kt'?",
    });
    expect(unknownField({ Kt: 2 }, ['Kt', 'Kf'], 'notch options')).toBeUndefined();
    expect(unknownField({ xyzzy: 1 }, ['Kt', 'Kf'], 'notch options')?.rule).toBe("unknown field 'xyzzy' in notch options; the fields are Kt, Kf");
  });
});
