import { nearestName } from './nearestName';

/**
 * The first own field of `record` that is not in `known`, with the rule it breaks: "unknown
 * field 'kt' in notch options; did you mean 'Kt'?" (the nearest known name by
 * {@link nearestName}), or the list of known fields when none is near. Undefined when every
 * field is known. Each package throws its own error class with the result, so an unknown or
 * mistyped option is an error everywhere instead of being ignored.
 *
 * @param record the options object (checked to be an object by the caller)
 * @param known the fields the options object may have
 * @param where what the object is, for the message (`notch options`, `rainflow options`)
 * @example
 * unknownField({ kt: 2 }, ['Kt', 'Kf', 'rule'], 'notch options')
 * // returns { field: 'kt', value: 2, rule: "unknown field 'kt' in notch options; did you mean 'Kt'?" }
 */
export function unknownField(
  record: object,
  known: readonly string[],
  where: string,
): { field: string; value: unknown; rule: string } | undefined {
  for (const field of Object.keys(record)) {
    if (known.includes(field)) continue;
    const near = nearestName(field, known);
    const rule = `unknown field '${field}' in ${where}; ${near !== undefined ? `did you mean '${near}'?` : `the fields are ${known.join(', ')}`}`;
    return { field, value: (record as Record<string, unknown>)[field], rule };
  }
  return undefined;
}
