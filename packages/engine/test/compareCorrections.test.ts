import { describe, expect, test } from 'vitest';
import { assessLife, compareCorrections } from '@loopwise/engine';
import type { DamageParameterName } from '@loopwise/mean-stress';
import { compatibleCyclicCurve, defineMaterial } from '@loopwise/material';
import { sae1045 } from './support';

describe('compareCorrections(events, job)', () => {
  test('each correction gives the life assessLife gives with it', () => {
    const history = [0, 320, -150, 280, -60, 300, 20];
    const job = { material: sae1045, notch: { Kt: 2 } };
    const all = compareCorrections([{ name: 'h', history, repeats: 1 }], job);
    expect(all.map((r) => r.meanStress)).toEqual(['none', 'morrow', 'modifiedMorrow', 'smithWatsonTopper', 'walker']);
    for (const r of all) {
      const single = assessLife(history, { ...job, meanStress: r.meanStress as DamageParameterName });
      expect(r.damagePerRepeat).toBe(single.damage.perRepeat);
    }
  });

  test('at zero mean stress, on a compatible material, every correction gives the same life', () => {
    // compatible cyclic curve: n' = b/c, K' = σf'/εf'^n' (the zero-mean equality of SWT and Walker
    // with `none` holds only then; see the mean-stress docs)
    const { K, n } = compatibleCyclicCurve(sae1045);
    const m = defineMaterial({ E: sae1045.E, sigmaF: sae1045.sigmaF, b: sae1045.b, epsilonF: sae1045.epsilonF, c: sae1045.c, K, n, Su: sae1045.Su, name: 'SAE 1045 with a compatible cyclic curve' });
    const all = compareCorrections([{ name: 'fully reversed', history: [250, -250], repeats: 1 }], { material: m, notch: { Kt: 2 } });
    const none = all.find((r) => r.meanStress === 'none')!.damagePerRepeat;
    for (const r of all) expect(Math.abs(r.damagePerRepeat - none) / none).toBeLessThan(1e-8);
  });
});
