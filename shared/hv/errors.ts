import { ERROR_CODES } from '../errors';

/**
 * Thrown for any input a calculation cannot answer honestly. A safety number computed from NaN,
 * a negative capacitance or a safe level above the start voltage would look valid on screen, so
 * the functions refuse instead of returning NaN or Infinity. `field` names the offending input
 * so the API can put the message beside the right form field.
 */
export class HvInputError extends Error {
  readonly code = ERROR_CODES.invalidInput;
  readonly field: string;

  constructor(field: string, message: string) {
    super(message);
    this.name = 'HvInputError';
    this.field = field;
  }
}
