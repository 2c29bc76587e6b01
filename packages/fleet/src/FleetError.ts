import { LoopwiseError } from '@loopwise/base';

/**
 * An error of the fleet's input: a manifest row, a file it names, a field, an option or a queue
 * address. `field` names what is at fault (`usage`, `channels`, `--queue`, …), `index` the
 * manifest row when there is one, and the message names the place as a person reads it
 * (`fleet.csv row 4: usage: …`). The command exits with code 2 on it.
 */
export class FleetError extends LoopwiseError {
  constructor(code: string, field: string, value: unknown, message: string, row?: number) {
    super(code, field, value, message, row);
  }
}
