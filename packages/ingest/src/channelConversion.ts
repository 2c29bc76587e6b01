import { IngestOptionError } from './IngestError.js';

/**
 * Megapascals in one ksi (kilopound-force per square inch): 1 ksi = 6.894757293168361 MPa.
 * Source: NIST Special Publication 811 (2008 edition), Guide for the Use of the International
 * System of Units, Appendix B.8 (factor for pound-force per square inch to pascal,
 * 6.894 757 E+03, exact value 6894.757293168361… from the exact definitions of the pound and
 * the standard acceleration of gravity).
 */
export const MPA_PER_KSI = 6.894757293168361;

/** Microstrain in one unit of strain. */
export const MICROSTRAIN_PER_STRAIN = 1e6;

/** What a channel holds and in which unit the file records it. */
export type ChannelQuantity =
  | { quantity: 'stress'; unit: 'MPa' | 'ksi' }
  | { quantity: 'strain'; unit: 'strain' | 'microstrain' }
  /** A load (force, moment, pressure…) in any unit, times `mpaPerUnit` to give nominal stress in MPa. */
  | { quantity: 'load'; mpaPerUnit: number };

/**
 * How a channel's file values become engine values: `engine = file × multiplier / divisor`
 * (one of the two is always 1, so every conversion is a single correctly rounded operation and a
 * plain channel is bit-exact with the file).
 */
export interface ChannelConversion {
  /** The engine unit of the converted values: MPa for stress and load, dimensionless strain. */
  readonly engineUnit: 'MPa' | 'strain';
  readonly multiplier: number;
  readonly divisor: number;
  /** The conversion in words, with its source, for reports. */
  readonly statement: string;
}

/**
 * The conversion of a channel's file values into the engine's units (MPa for stress, strain
 * dimensionless): ksi × {@link MPA_PER_KSI} (NIST SP 811), microstrain ÷ 10^6, load × the
 * caller's factor to nominal stress in MPa, MPa and plain strain unchanged. Division by 10^6
 * rather than multiplication by 1e-6 keeps it one correctly rounded operation (1e-6 is not
 * exact in binary).
 *
 * @param spec - the channel's quantity and unit
 * @param field - the option name reported when the spec is invalid
 * @throws IngestOptionError when the unit is unknown or the load factor is not finite and non-zero
 *
 * @example
 * channelConversion({ quantity: 'strain', unit: 'microstrain' }).divisor;
 * // returns 1000000
 */
export function channelConversion(spec: ChannelQuantity, field = 'quantity'): ChannelConversion {
  switch (spec?.quantity) {
    case 'stress':
      if (spec.unit === 'MPa') return { engineUnit: 'MPa', multiplier: 1, divisor: 1, statement: 'stress in MPa, unchanged' };
      if (spec.unit === 'ksi')
        return {
          engineUnit: 'MPa',
          multiplier: MPA_PER_KSI,
          divisor: 1,
          statement: `stress in ksi × ${MPA_PER_KSI} MPa/ksi (NIST SP 811, Appendix B.8)`,
        };
      throw new IngestOptionError(`${field}.unit`, spec.unit, "stress units are 'MPa' or 'ksi'");
    case 'strain':
      if (spec.unit === 'strain') return { engineUnit: 'strain', multiplier: 1, divisor: 1, statement: 'strain, dimensionless, unchanged' };
      if (spec.unit === 'microstrain')
        return { engineUnit: 'strain', multiplier: 1, divisor: MICROSTRAIN_PER_STRAIN, statement: 'microstrain ÷ 10^6 to strain' };
      throw new IngestOptionError(`${field}.unit`, spec.unit, "strain units are 'strain' or 'microstrain'");
    case 'load': {
      const f = spec.mpaPerUnit;
      if (typeof f !== 'number' || !Number.isFinite(f) || f === 0)
        throw new IngestOptionError(`${field}.mpaPerUnit`, f, 'the load-to-stress factor must be a finite, non-zero number (MPa per load unit)');
      return { engineUnit: 'MPa', multiplier: f, divisor: 1, statement: `load × ${f} MPa per load unit to nominal stress` };
    }
    default:
      throw new IngestOptionError(`${field}.quantity`, (spec as { quantity?: unknown } | undefined)?.quantity, "quantity is 'stress', 'strain' or 'load'");
  }
}
