import { CalculationInputError } from '../errors';

/** Why an uploaded signal cannot be analysed; the API turns each code into its own problem type. */
export type SignalProblemCode =
  | 'emptyFile'
  | 'notWav'
  | 'truncated'
  | 'malformed'
  | 'unsupportedEncoding'
  | 'unsupportedSampleRate'
  | 'tooLong'
  | 'tooShort'
  | 'channelRequired'
  | 'channelOutOfRange'
  | 'invalidSamples'
  | 'silent';

/** A signal (usually an uploaded file) that cannot be analysed. `field` names the request part at fault. */
export class SignalProblemError extends CalculationInputError {
  constructor(
    message: string,
    readonly code: SignalProblemCode,
    field = '/file',
  ) {
    super(message, field);
  }
}
